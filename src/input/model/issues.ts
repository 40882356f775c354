/**
 * zod issues → gvf Problems. The issue is data (code, path, input); the words come from messages.ts.
 * Paths are printed the way a user finds the place in the file: `reaches[1].slope`, `sections.lined.n`.
 */
import type { Problem } from '../../core/errors.js';
import type * as z from 'zod';
import * as msg from './messages.js';

type PathSegment = PropertyKey;

const identifier = /^[A-Za-z_$][A-Za-z0-9_$]*$/;

/** `reaches[1].slope` from ['reaches', 1, 'slope']. */
export function formatPath(path: readonly PathSegment[]): string {
  let out = '';
  for (const segment of path) {
    if (typeof segment === 'number') out += `[${segment}]`;
    else {
      const key = String(segment);
      out += identifier.test(key) ? (out === '' ? key : `.${key}`) : `[${JSON.stringify(key)}]`;
    }
  }
  return out;
}

const typeWords: Record<string, string> = {
  number: 'a number',
  string: 'text in double quotes',
  array: 'a list [...]',
  tuple: 'a list [...]',
  object: 'an object {...}',
  boolean: 'true or false',
  record: 'an object {...} of named entries',
};

/** The per-parse error map: one message per issue code, from the catalogue. Schema-level messages win over it. */
export function issueMessage(issue: z.core.$ZodRawIssue): string | undefined {
  switch (issue.code) {
    case 'invalid_type': {
      const words = typeWords[issue.expected] ?? issue.expected;
      if (issue.input === undefined) return msg.missing(words);
      if (issue.expected === 'number' && typeof issue.input === 'number') return msg.notFinite(issue.input);
      return msg.expected(words, issue.input);
    }
    case 'invalid_value':
      if (issue.input === undefined) return msg.missingOneOf(issue.values.map(String));
      return msg.expectedOneOf(issue.values.map(String), issue.input);
    case 'invalid_union': {
      // a discriminated union names its tag; the input is the object that holds it
      const { discriminator, options } = issue as { discriminator?: string; options?: unknown[] };
      if (discriminator === undefined || options === undefined) return undefined;
      const tag = issue.input !== null && typeof issue.input === 'object' ? (issue.input as Record<string, unknown>)[discriminator] : undefined;
      const values = options.map(String);
      return tag === undefined ? msg.missingOneOf(values) : msg.expectedOneOf(values, tag);
    }
    case 'too_small': {
      const minimum = Number(issue.minimum);
      if (issue.origin === 'array' || issue.origin === 'set') return msg.listTooShort(minimum, minimum === 1 ? 'entry' : 'entries', issue.input);
      if (issue.origin === 'string') return msg.expected('a non-empty name', issue.input);
      return issue.inclusive ? msg.atLeast(minimum, issue.input) : msg.greaterThan(minimum, issue.input);
    }
    case 'too_big': {
      const maximum = Number(issue.maximum);
      return issue.inclusive ? msg.atMost(maximum, issue.input) : msg.lessThan(maximum, issue.input);
    }
    case 'invalid_key':
      return msg.expected('a non-empty name', issue.input);
    default:
      return undefined;
  }
}

/** Convert the issues of a failed parse. `schema` and `input` let unknown-key messages list the allowed keys. */
export function issuesToProblems(
  issues: readonly z.core.$ZodIssue[],
  schema: z.ZodType,
  input: unknown,
  prefix: readonly PathSegment[] = [],
): Problem[] {
  const problems: Problem[] = [];
  for (const issue of issues) {
    const path = [...prefix, ...issue.path];
    if (issue.code === 'unrecognized_keys') {
      const allowed = allowedKeys(schema, input, path);
      for (const key of issue.keys) {
        problems.push({ where: formatPath([...path, key]), message: msg.unknownKey(key, allowed), value: valueAt(input, [...path, key]) });
      }
      continue;
    }
    if (issue.code === 'invalid_union') {
      const discriminator = (issue as { discriminator?: string }).discriminator;
      if (discriminator !== undefined) {
        // zod puts the discriminator in the path; the input is the object holding it
        problems.push({ where: formatPath(path), message: issue.message, value: valueAt(input, path) });
        continue;
      }
      // the branch whose type matched (its issues lie deeper) says what is wrong inside it
      const deeper = issue.errors.filter((branch) => branch.length > 0 && branch.every((i) => i.path.length > 0));
      if (deeper.length === 1) {
        problems.push(...issuesToProblems(deeper[0]!, schema, input, path));
        continue;
      }
      // otherwise the branch whose keys fit the object best (fewest unknown keys at its top), when one does
      const unknownAtTop = (branch: readonly z.core.$ZodIssue[]) =>
        branch.reduce((k, i) => k + (i.code === 'unrecognized_keys' && i.path.length === 0 ? i.keys.length : 0), 0);
      const counts = issue.errors.map(unknownAtTop);
      const fewest = Math.min(...counts);
      if (counts.filter((c) => c === fewest).length === 1 && counts.some((c) => c > fewest)) {
        problems.push(...issuesToProblems(issue.errors[counts.indexOf(fewest)]!, schema, input, path));
        continue;
      }
    }
    problems.push({ where: formatPath(path), message: issue.message, value: valueAt(input, path) });
  }
  return problems;
}

function valueAt(input: unknown, path: readonly PathSegment[]): unknown {
  let value = input;
  for (const segment of path) {
    if (value === null || typeof value !== 'object') return undefined;
    value = (value as Record<PropertyKey, unknown>)[segment];
  }
  return value;
}

interface Def {
  type: string;
  innerType?: z.ZodType;
  in?: z.ZodType;
  shape?: Record<string, z.ZodType>;
  element?: z.ZodType;
  valueType?: z.ZodType;
  items?: z.ZodType[];
  options?: z.ZodType[];
  discriminator?: string;
}

const defOf = (schema: z.ZodType): Def => (schema as unknown as { _zod: { def: Def } })._zod.def;

/** Strip wrappers (optional, default, ...) and pick the union option that the value selects. */
function settle(schema: z.ZodType, value: unknown): z.ZodType {
  for (let depth = 0; depth < 16; depth++) {
    const def = defOf(schema);
    if (def.innerType !== undefined) schema = def.innerType;
    else if (def.type === 'pipe' && def.in !== undefined) schema = def.in;
    else if (def.type === 'union' && def.options !== undefined) {
      const chosen = chooseOption(def, value);
      if (chosen === undefined) return schema;
      schema = chosen;
    } else return schema;
  }
  return schema;
}

function chooseOption(def: Def, value: unknown): z.ZodType | undefined {
  const options = def.options ?? [];
  if (def.discriminator !== undefined && value !== null && typeof value === 'object') {
    const tag = (value as Record<string, unknown>)[def.discriminator];
    return options.find((option) => {
      const literal = defOf(option).shape?.[def.discriminator!];
      return literal !== undefined && (defOf(literal) as { values?: unknown[] }).values?.includes(tag);
    });
  }
  const fitting = options.filter((option) => {
    const type = defOf(settle(option, value)).type;
    return (type === 'object') === (value !== null && typeof value === 'object' && !Array.isArray(value));
  });
  if (fitting.length < 2 || value === null || typeof value !== 'object') return fitting[0];
  // several object options: the one whose shape holds most of the value's keys
  const keys = Object.keys(value);
  const held = (option: z.ZodType) => keys.filter((k) => defOf(settle(option, value)).shape?.[k] !== undefined).length;
  return fitting.reduce((best, option) => (held(option) > held(best) ? option : best));
}

function allowedKeys(root: z.ZodType, input: unknown, path: readonly PathSegment[]): string[] {
  let schema = settle(root, input);
  let value = input;
  for (const segment of path) {
    const def = defOf(schema);
    value = valueAt(value, [segment]);
    let next: z.ZodType | undefined;
    if (def.type === 'object') next = def.shape?.[String(segment)];
    else if (def.type === 'array') next = def.element;
    else if (def.type === 'record') next = def.valueType;
    else if (def.type === 'tuple') next = def.items?.[Number(segment)];
    if (next === undefined) return [];
    schema = settle(next, value);
  }
  const shape = defOf(schema).shape;
  return shape === undefined ? [] : Object.keys(shape);
}
