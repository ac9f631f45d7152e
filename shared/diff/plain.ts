// Helpers for the plain JSON-like values the diff works on. Documents reach the diff
// from YAML, from the database's jsonb or from a test's generator; none of them is
// trusted to be acyclic, JSON-only or schema-valid, and the diff must never throw.

export type PlainObject = Record<string, unknown>;

export function isPlainObject(value: unknown): value is PlainObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

// A fresh JSON-compatible copy: undefined and functions are dropped, cycles become
// null, anything else that JSON cannot carry becomes its string form. A fresh copy
// also means no object is shared between the two sides of a diff, which the
// identity matching relies on. `bare` makes objects without a prototype: jsondiffpatch
// reads `right[name]` for every key of the left object, so a key such as `toString`
// would otherwise meet Object.prototype's function and make it throw.
export function toPlain(value: unknown, bare = false, seen: Set<object> = new Set()): unknown {
  if (value === null) return null;
  switch (typeof value) {
    case 'string':
    case 'boolean':
      return value;
    case 'number':
      return Number.isFinite(value) ? value : String(value);
    case 'bigint':
      return value.toString();
    case 'undefined':
    case 'function':
    case 'symbol':
      return undefined;
  }
  const object = value as object;
  if (seen.has(object)) return null;
  if (object instanceof Date) return Number.isNaN(object.getTime()) ? null : object.toISOString();
  seen.add(object);
  try {
    if (Array.isArray(object)) return object.map((item) => toPlain(item, bare, seen) ?? null);
    const copy: PlainObject = bare ? Object.create(null) : {};
    for (const [key, item] of Object.entries(object)) {
      const plain = toPlain(item, bare, seen);
      if (plain !== undefined) setOwn(copy, key, plain);
    }
    return copy;
  } finally {
    seen.delete(object);
  }
}

export function deepEqual(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (Array.isArray(a)) {
    return Array.isArray(b) && a.length === b.length && a.every((item, index) => deepEqual(item, b[index]));
  }
  if (isPlainObject(a) && isPlainObject(b)) {
    const keysA = Object.keys(a);
    if (keysA.length !== Object.keys(b).length) return false;
    return keysA.every((key) => Object.prototype.hasOwnProperty.call(b, key) && deepEqual(a[key], b[key]));
  }
  return false;
}

// Key order does not matter, list order does: two objects with the same fields in a
// different order give the same string.
export function stableStringify(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(stableStringify).join(',')}]`;
  if (isPlainObject(value)) {
    const keys = Object.keys(value).sort();
    return `{${keys.map((key) => `${JSON.stringify(key)}:${stableStringify(value[key])}`).join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}

export function withoutKey(value: PlainObject, key: string): PlainObject {
  const rest: PlainObject = {};
  for (const [name, item] of Object.entries(value)) if (name !== key) setOwn(rest, name, item);
  return rest;
}

// A YAML key may well be `__proto__`; plain assignment would change the prototype
// instead of adding a field.
export function setOwn(target: PlainObject, key: string, value: unknown): void {
  if (key === '__proto__') Object.defineProperty(target, key, { value, enumerable: true, writable: true, configurable: true });
  else target[key] = value;
}
