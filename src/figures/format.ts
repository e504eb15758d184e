/** Number formatting for figure text: short, no trailing zeros, a true minus sign. */

/** x with at most `digits` decimals, trailing zeros dropped, '−' for negatives (−0 shown as 0). */
export function formatNumber(x: number, digits = 2): string {
  if (!Number.isFinite(x)) return String(x);
  const text = x.toFixed(digits).replace(/\.?0+$/, '');
  return text === '-0' ? '0' : text.replace('-', '−');
}

/** A fraction p/q in lowest terms ("0" for 0, "1" for 1). */
export function formatFraction(p: number, q: number): string {
  let a = Math.abs(p);
  let b = Math.abs(q);
  while (b) [a, b] = [b, a % b];
  const g = a || 1;
  return q / g === 1 ? String(p / g) : `${p / g}/${q / g}`;
}
