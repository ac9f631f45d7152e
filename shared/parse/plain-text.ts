type Scalar = string | number | boolean | bigint | symbol | null | undefined;

const isScalar = (value: unknown): value is Scalar =>
  value === null || (typeof value !== 'object' && typeof value !== 'function');

/**
 * A value read from YAML or JSON as plain text: a scalar as `String` writes it, a list or
 * a mapping as JSON, so a stray collection never reads "[object Object]".
 */
export function plainText(value: unknown): string {
  return isScalar(value) ? String(value) : JSON.stringify(value);
}
