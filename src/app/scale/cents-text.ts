/** Cents as the designer shows them: `701.955¢`, to `digits` decimals. */
export function centsText(cents: number, digits = 3): string {
  return `${cents.toFixed(digits)}¢`;
}

/** A deviation with its sign always written, a true minus for negatives: `+13.7¢`, `−2.0¢`. */
export function signedCentsText(cents: number, digits = 1): string {
  const rounded = Number(cents.toFixed(digits));
  const sign = rounded > 0 ? '+' : rounded < 0 ? '−' : '±';
  return `${sign}${Math.abs(rounded).toFixed(digits)}¢`;
}
