/**
 * The cubic expo curve of docs/format.md: y = (1 - k) x + k x^3 with k = expo / 100 and x
 * in -1..1. For 0 <= k <= 1 it is monotonic (its slope (1 - k) + 3 k x^2 is never
 * negative), passes through 0 and +-1, and softens the response around centre.
 */
export function expoCurve(x: number, expo: number): number {
  const k = expo / 100;
  return (1 - k) * x + k * x * x * x;
}
