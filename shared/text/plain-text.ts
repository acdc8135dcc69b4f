// Text that people type (names, notes, queries) on its way into the database, files and mail.
import * as z from 'zod';

const nul = '\u0000';
const loneSurrogate = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;
const controlCharacters = /[\u0000-\u001f\u007f]/g;
const controlRuns = /[\u0000-\u001f\u007f]+/g;
const loneSurrogates = new RegExp(loneSurrogate.source, 'g');

/** Why text cannot be stored as it is (PostgreSQL holds neither NUL nor half a character), or null. */
export function unstorableText(text: string): string | null {
  if (text.includes(nul)) return 'must not hold the NUL character (\\u0000)';
  if (loneSurrogate.test(text)) return 'holds half of a character (a lone UTF-16 surrogate)';
  return null;
}

/** A zod string that PostgreSQL can store: NUL and lone surrogates are refused with a plain message. */
export function storableString(): z.ZodString {
  return z.string().superRefine((text, context) => {
    const fault = unstorableText(text);
    if (fault) context.addIssue({ code: 'custom', message: fault });
  });
}

/** The text with control characters and half characters taken out (for file names from uploads). */
export function withoutControlCharacters(text: string): string {
  return text.replace(controlCharacters, '').replace(loneSurrogates, '');
}

/** The text on one line: each run of line breaks, tabs and other control characters becomes one space. */
export function singleLine(text: string): string {
  return text.replace(controlRuns, ' ').replace(loneSurrogates, '').trim();
}
