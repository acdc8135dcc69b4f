import type * as z from 'zod';
import { type FieldError, fieldError } from '../result';

/** Writes a zod path as the field path of the preset document: `scale.degrees[3]`. */
function fieldPath(path: readonly PropertyKey[]): string {
  let written = '';
  for (const part of path) {
    if (typeof part === 'number') written += `[${part}]`;
    else written += written === '' ? String(part) : `.${String(part)}`;
  }
  return written === '' ? 'document' : written;
}

const typeWords: Record<string, string> = {
  string: 'text',
  number: 'a number',
  int: 'a whole number',
  boolean: 'true or false',
  object: 'an object',
  array: 'a list',
  tuple: 'a list',
};

function bound(issue: { inclusive?: boolean }, inclusiveWord: string, exclusiveWord: string) {
  return issue.inclusive === false ? exclusiveWord : inclusiveWord;
}

/** Whether a size check is about a number's value (an int's safe range included) rather than a length. */
function numeric(origin: string): boolean {
  return origin === 'number' || origin === 'int' || origin === 'bigint';
}

/** The values allowed, as words: `owner, editor or viewer`; a single value is quoted as the literal it is. */
function choices(values: readonly unknown[]): string {
  if (values.length < 2 || !values.every((value) => typeof value === 'string')) {
    return values.map((value) => JSON.stringify(value)).join(' or ');
  }
  return `${values.slice(0, -1).join(', ')} or ${values[values.length - 1]}`;
}

function countWord(origin: string): string {
  return origin === 'string' ? 'characters' : 'entries';
}

/** What the user wrote, when it is short enough to quote. */
function got(input: unknown): string {
  const quotable = input === null || ['string', 'number', 'boolean'].includes(typeof input);
  const quoted = quotable ? JSON.stringify(input) : '';
  return quoted && quoted.length <= 40 ? ` (got ${quoted})` : '';
}

/**
 * The fault of one issue, in plain words and without its path. A discriminated union names its
 * options; a plain union keeps the message its schema gave it.
 */
function fault(issue: z.core.$ZodIssue): string {
  const input = 'input' in issue ? issue.input : undefined;
  const received = got(input);
  switch (issue.code) {
    case 'invalid_type':
      if (input === undefined) return 'is required';
      return `must be ${typeWords[issue.expected] ?? issue.expected}${received}`;
    case 'invalid_union': {
      if ('discriminator' in issue && typeof issue.discriminator === 'string') {
        const kind = (input as Record<string, unknown> | undefined)?.[issue.discriminator];
        if (kind === undefined) return 'is required';
        const options = 'options' in issue && Array.isArray(issue.options) ? issue.options : [];
        return `must be one of ${options.map(String).join(', ')}${got(kind)}`;
      }
      if (input === undefined) return 'is required';
      return `${issue.message}${received}`;
    }
    case 'too_small':
      if (numeric(issue.origin)) {
        return `must be ${bound(issue, 'at least', 'above')} ${issue.minimum}${received}`;
      }
      if (issue.origin === 'string' && issue.minimum === 1) return 'must not be empty';
      return `must have at least ${issue.minimum} ${countWord(issue.origin)}`;
    case 'too_big':
      if (numeric(issue.origin)) {
        return `must be ${bound(issue, 'at most', 'below')} ${issue.maximum}${received}`;
      }
      return `must have at most ${issue.maximum} ${countWord(issue.origin)}`;
    case 'invalid_value': {
      if (input === undefined) return 'is required';
      return `must be ${choices(issue.values)}${received}`;
    }
    default:
      return issue.message;
  }
}

/**
 * Turns zod issues into faults that name their field; an unknown key becomes a fault at that key.
 */
export function schemaFaults(issues: readonly z.core.$ZodIssue[]): FieldError[] {
  return issues.flatMap((issue) => {
    const inner = shapeMatchedOption(issue);
    if (inner)
      return schemaFaults(
        inner.map((option) => ({ ...option, path: [...issue.path, ...option.path] })),
      );
    return issue.code === 'unrecognized_keys'
      ? issue.keys.map((key) =>
          // A key too long to quote is named by its start: the answer stays short.
          fieldError(
            fieldPath([...issue.path, key.length > 40 ? `${key.slice(0, 40)}...` : key]),
            'is not a field here',
          ),
        )
      : [fieldError(fieldPath(issue.path), fault(issue))];
  });
}

/**
 * For a plain union (a temper that is one link or a list of links), the faults of the one option whose shape the
 * input has: its faults lie inside the value rather than at the value itself. Null when no single option fits.
 */
function shapeMatchedOption(issue: z.core.$ZodIssue): z.core.$ZodIssue[] | null {
  if (issue.code !== 'invalid_union' || ('discriminator' in issue && issue.discriminator))
    return null;
  const options =
    'errors' in issue && Array.isArray(issue.errors) ? (issue.errors as z.core.$ZodIssue[][]) : [];
  const fitting = options.filter(
    (option) => option.length > 0 && option.every((inner) => inner.path.length > 0),
  );
  return fitting.length === 1 ? fitting[0] : null;
}
