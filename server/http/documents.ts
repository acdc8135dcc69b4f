import { parsePresetDocument, type ResolvedPreset } from '../../shared/preset/preset-document';
import { ValidationError } from './validation';

/** A preset document inside a request body: its faults are named under the body field that holds it. */
export function documentOrThrow(input: unknown, field = 'document'): ResolvedPreset {
  const parsed = parsePresetDocument(input);
  if (parsed.ok) return parsed.value;
  throw new ValidationError(
    parsed.errors.map((e) => ({ path: `${field}.${e.path}`, message: `${field}.${e.message}` })),
  );
}
