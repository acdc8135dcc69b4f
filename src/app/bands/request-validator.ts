import type { ValidatorFn } from '@angular/forms';
import { parseRequest } from '@shared/api/requests';
import * as z from 'zod';

/**
 * A form control validator from one field of a request schema (`@shared/api/requests`), so that the form
 * refuses what the server would. The fault reads as a sentence about `subject` ("The band name must not be
 * empty.") and sits at `errors.request`.
 */
export function requestFieldValidator(
  schema: z.ZodObject,
  field: string,
  subject: string,
): ValidatorFn {
  const fieldSchema = z.object({ [field]: schema.shape[field] });
  return (control) => {
    const result = parseRequest(fieldSchema, { [field]: control.value });
    if (result.ok) return null;
    const error = result.errors[0];
    const fault = error.message.startsWith(`${error.path}: `)
      ? error.message.slice(error.path.length + 2)
      : error.message;
    return { request: `${subject} ${fault}.` };
  };
}
