/** A fault in what the user wrote: its field path (`scale.degrees[3]`) and a message. */
export interface FieldError {
  path: string;
  message: string;
}

/** What every parser and builder returns: a value, or the faults found, never an exception. */
export type Result<T> = { ok: true; value: T } | { ok: false; errors: FieldError[] };

/** A fault at `path`; the message starts with the path so that it reads on its own. */
export function fieldError(path: string, fault: string): FieldError {
  return { path, message: `${path}: ${fault}` };
}

export function succeed<T>(value: T): Result<T> {
  return { ok: true, value };
}

export function fail<T>(errors: FieldError[]): Result<T> {
  return { ok: false, errors };
}
