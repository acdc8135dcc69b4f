import type { FieldError, Result } from '../../shared/result';
import { HttpError } from './errors';

/** The faults of a parse as a 400: the first names the field; all of them travel along in `details`. */
export class ValidationError extends HttpError {
  constructor(readonly details: FieldError[]) {
    super(400, 'invalid', details[0]?.message ?? 'The request is not valid.', details[0]?.path);
  }
}

/** The value of a successful parse, or a ValidationError carrying every fault. */
export function valueOrThrow<T>(result: Result<T>): T {
  if (!result.ok) throw new ValidationError(result.errors);
  return result.value;
}
