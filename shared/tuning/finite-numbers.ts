/**
 * Where plain data (numbers, text, lists, objects) holds NaN or an infinite number, as a path such as
 * `degrees[3].cents`; null when every number in it is finite. No table, file or stored document may
 * carry such a number: it reads as nonsense in a file and as silence or a zero in MIDI bytes.
 */
export function firstNonFinite(value: unknown, path = ''): string | null {
  if (typeof value === 'number') return Number.isFinite(value) ? null : path || 'value';
  if (Array.isArray(value)) {
    for (let index = 0; index < value.length; index++) {
      const found = firstNonFinite(value[index], `${path}[${index}]`);
      if (found) return found;
    }
    return null;
  }
  if (
    typeof value === 'object' &&
    value !== null &&
    Object.getPrototypeOf(value) === Object.prototype
  ) {
    for (const [key, inner] of Object.entries(value)) {
      const found = firstNonFinite(inner, path ? `${path}.${key}` : key);
      if (found) return found;
    }
  }
  return null;
}
