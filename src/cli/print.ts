/**
 * What the CLI writes and how it exits. Only the CLI prints; the library throws typed errors.
 *
 * Exit codes: 0 done; 2 bad input (InputError, or a HydraulicError: a request that cannot be met by
 * physics, such as a depth above a conduit's crown); 1 anything else (a method failing its bounds, a bug),
 * with one line, and the stack only when GVF_DEBUG=1.
 */
import { GvfError, HydraulicError, InputError, NumericalError, formatProblem } from '../core/errors.js';
import * as msg from '../input/model/messages.js';

export const exitCode = { ok: 0, failure: 1, badInput: 2 } as const;

/** JSON with non-finite numbers as null (JSON has no NaN or Infinity; none may escape as text). */
export function toJson(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? null : v), 2);
}

export interface Streams {
  out: (text: string) => void;
  err: (text: string) => void;
}

export const processStreams: Streams = {
  out: (text) => process.stdout.write(text.endsWith('\n') ? text : `${text}\n`),
  err: (text) => process.stderr.write(text.endsWith('\n') ? text : `${text}\n`),
};

/** Print an error as the user should see it and return the exit code. */
export function reportError(error: unknown, streams: Streams, context?: { file?: string }): number {
  const debug = process.env.GVF_DEBUG === '1';
  if (error instanceof InputError) {
    const file = (error as { file?: string }).file ?? context?.file;
    const lines = error.problems.map((p) => `  ${formatProblem(p)}`);
    const count = error.problems.length;
    const head = file !== undefined && error.problems.some((p) => !p.where.startsWith(file)) ? msg.invalidModelHeading(file, count) : msg.badInputHeading(count);
    streams.err([head, ...lines].join('\n'));
    if (debug) streams.err(error.stack ?? '');
    return exitCode.badInput;
  }
  if (error instanceof HydraulicError) {
    streams.err(msg.cannotBeComputed(oneLine(error.message)));
    if (debug) streams.err(error.stack ?? '');
    return exitCode.badInput;
  }
  if (error instanceof NumericalError || error instanceof GvfError) {
    streams.err(msg.computationFailed(oneLine(error.message)));
    if (debug) streams.err(error.stack ?? '');
    return exitCode.failure;
  }
  const message = error instanceof Error ? error.message : String(error);
  streams.err(msg.unexpectedError(oneLine(message)));
  if (debug && error instanceof Error) streams.err(error.stack ?? '');
  return exitCode.failure;
}

function oneLine(text: string): string {
  return text.replace(/\s*\n\s*/g, '; ');
}
