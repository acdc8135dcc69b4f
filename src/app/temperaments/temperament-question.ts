import {
  type PrimeLimit,
  type TemperamentRequest,
  type TemperamentTuning,
  largestMosSize,
} from '@shared/api/temperaments';
import type { ApiError } from '../api/api-error';

/** What says which intervals matter: a prime limit, or intervals the composer lists. */
export type Measure = 'limit' | 'targets';
/** Where the commas come from: the composer names them, or asks for suggestions for a number of notes. */
export type CommaSource = 'commas' | 'suggest';

/** The search form as the composer left it: lists still as typed. */
interface QuestionForm {
  measure: Measure;
  limit: PrimeLimit;
  targets: string;
  commaSource: CommaSource;
  commas: string;
  count: string;
  tunings: TemperamentTuning[];
}

/** The fields of the form, named as the request names them. */
const questionFields = ['limit', 'targets', 'commas', 'count', 'tunings'] as const;
export type QuestionField = (typeof questionFields)[number];

/** A fault to show: beside its field, or (field null) for the question as a whole. */
export interface QuestionFault {
  field: QuestionField | null;
  message: string;
}

/** The intervals of a list as typed: separated by spaces, commas or semicolons (`3/2 5/4, 6/5`). */
export function intervalList(text: string): string[] {
  return text.split(/[\s,;]+/).filter((entry) => entry !== '');
}

/**
 * The request the form asks, or the fault that keeps it from being asked. Only what cannot be sent at all is judged
 * here (an empty list, a count that is not a whole number); the intervals themselves are the server's to judge.
 */
export function requestFrom(
  form: QuestionForm,
): { ok: true; request: TemperamentRequest } | { ok: false; fault: QuestionFault } {
  const refuse = (field: QuestionField, message: string) => ({
    ok: false as const,
    fault: { field, message },
  });
  const targets = intervalList(form.targets);
  const commas = intervalList(form.commas);
  const count = Number(form.count.trim());
  if (form.measure === 'targets' && targets.length === 0) {
    return refuse('targets', 'Name at least one interval, such as 3/2 5/4 6/5.');
  }
  if (form.commaSource === 'commas' && commas.length === 0) {
    return refuse('commas', 'Name at least one comma, such as 81/80, or ask for suggestions.');
  }
  if (
    form.commaSource === 'suggest' &&
    (form.count.trim() === '' || !Number.isInteger(count) || count < 2 || count > largestMosSize)
  ) {
    return refuse('count', `Give a whole number of notes from 2 to ${largestMosSize}.`);
  }
  if (form.tunings.length === 0) return refuse('tunings', 'Choose at least one tuning.');
  return {
    ok: true,
    request: {
      ...(form.measure === 'limit' ? { limit: form.limit } : { targets }),
      ...(form.commaSource === 'commas' ? { commas } : { count }),
      tunings: form.tunings,
    },
  };
}

const itemNames: Partial<Record<QuestionField, string>> = { targets: 'Interval', commas: 'Comma' };

/**
 * A refusal from the server, placed beside the field it names (`commas[1]` is the second comma of the commas field),
 * its message without the path the field already shows. A refusal naming no field of the form is the question's.
 */
export function faultFrom(error: ApiError): QuestionFault {
  const named = error.field ?? '';
  const top = named.split(/[.[]/)[0];
  const field = (questionFields as readonly string[]).includes(top) ? (top as QuestionField) : null;
  if (!field) return { field: null, message: error.message };
  const prefix = `${named}: `;
  const message = error.message.startsWith(prefix)
    ? error.message.slice(prefix.length)
    : error.message;
  const item = /^\w+\[(\d+)\]$/.exec(named);
  const itemName = itemNames[field];
  return {
    field,
    message: item && itemName ? `${itemName} ${Number(item[1]) + 1}: ${message}` : message,
  };
}
