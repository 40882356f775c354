/**
 * Typed errors. Library code throws these; only the CLI prints them and picks an exit code.
 *
 * A problem is data (after zod's issues): where it is, what was found, what is accepted.
 * `where` is a flag (`--n`), a JSON path (`reaches[1].slope`) or a file position (`stations.csv:4:2`).
 */
export interface Problem {
  /** The place: a CLI flag, a JSON path, or file:line:column. */
  readonly where: string;
  /** What is wrong and what is accepted, in words a user can act on. */
  readonly message: string;
  /** The offending value, when there is one. */
  readonly value?: unknown;
}

export function formatProblem(problem: Problem): string {
  return `${problem.where}: ${problem.message}`;
}

/** Base class of every error gvf throws on purpose. */
export class GvfError extends Error {
  override readonly name: string = 'GvfError';
}

/** Bad input from the user (flags, model file, CSV). The CLI exits with code 2. */
export class InputError extends GvfError {
  override readonly name = 'InputError';
  readonly problems: readonly Problem[];
  constructor(problems: Problem | readonly Problem[]) {
    const list = Array.isArray(problems) ? (problems as readonly Problem[]) : [problems as Problem];
    super(list.map(formatProblem).join('\n'));
    this.problems = list;
  }
}

/** A physically impossible request (e.g. normal depth on an adverse slope, a depth above the crown). */
export class HydraulicError extends GvfError {
  override readonly name = 'HydraulicError';
}

/** A numerical method failed within its bounds (no bracket, no convergence). States what was tried. */
export class NumericalError extends GvfError {
  override readonly name = 'NumericalError';
}

/** Throw an InputError unless `condition` holds. */
export function requireInput(condition: boolean, where: string, message: string, value?: unknown): asserts condition {
  if (!condition) throw new InputError({ where, message, value });
}

/** Format a number for a message without losing what the user typed. */
export function show(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : String(value);
  if (value === undefined) return 'nothing';
  try {
    return JSON.stringify(value);
  } catch {
    return String(value);
  }
}
