/** Joins class names, skipping the falsy ones of conditional classes. */
export function cx(...classes: Array<string | false | null | undefined>): string {
  return classes.filter(Boolean).join(' ');
}
