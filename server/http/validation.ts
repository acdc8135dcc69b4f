import type { FieldError, Result } from '../../shared/result';
import { HttpError } from './errors';

/** The most faults one answer lists; the rest are counted in `more`, so that a huge bad body gets a short answer. */
export const listedFaults = 20;

/** The faults of a parse as a 400: the first names the field; the first `listedFaults` travel along in `details`. */
export class ValidationError extends HttpError {
  readonly details: FieldError[];
  readonly more: number;

  constructor(faults: FieldError[]) {
    super(400, 'invalid', faults[0]?.message ?? 'The request is not valid.', faults[0]?.path);
    this.details = faults.slice(0, listedFaults);
    this.more = faults.length - this.details.length;
  }
}

/** The value of a successful parse, or a ValidationError carrying its faults. */
export function valueOrThrow<T>(result: Result<T>): T {
  if (!result.ok) throw new ValidationError(result.errors);
  return result.value;
}
