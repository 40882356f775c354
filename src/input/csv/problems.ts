/**
 * Collecting the problems of one input file so the user sees them all at once (up to a cap),
 * then throwing one InputError. A problem is data (after zod's issues): where, what, the value.
 */
import { InputError, type Problem } from '../../core/errors.js';

/** At most this many problems are listed; one more line says how many were left out. */
export const problemCap = 50;

/** `file:line:column` (or `file:line` when no column applies). */
export function at(file: string, line: number, column?: number): string {
  return column === undefined ? `${file}:${line}` : `${file}:${line}:${column}`;
}

export class ProblemList {
  private readonly list: Problem[] = [];
  private dropped = 0;

  add(where: string, message: string, value?: unknown): void {
    if (this.list.length < problemCap) {
      this.list.push(value === undefined ? { where, message } : { where, message, value });
    } else {
      this.dropped += 1;
    }
  }

  get size(): number {
    return this.list.length + this.dropped;
  }

  /** Throw one InputError listing every problem found, if there is any. */
  throwIfAny(file: string): void {
    if (this.size === 0) return;
    // In file order, so the user can work down the file; problems without a position keep their place.
    const problems = this.list
      .map((problem, order) => ({ problem, order, key: position(problem.where) }))
      .sort((x, y) => x.key[0] - y.key[0] || x.key[1] - y.key[1] || x.order - y.order)
      .map((entry) => entry.problem);
    if (this.dropped > 0) {
      problems.push({ where: file, message: `and ${this.dropped} more problems not listed (fix the ones above first)` });
    }
    throw new InputError(problems);
  }
}

/** [line, column] of a `file:line[:column]` place; [0, 0] for anything else. */
function position(where: string): [number, number] {
  const match = /:(\d+)(?::(\d+))?$/.exec(where);
  return match ? [Number(match[1]), Number(match[2] ?? 0)] : [0, 0];
}
