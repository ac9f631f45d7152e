import { plainText } from '@shared/parse/plain-text';
import type { DocumentEdit } from '@shared/edit/document-edits';

// Reading the plain YAML value for the forms. The forms show whatever the text holds,
// valid or not (the checks say what is wrong), so every read is defensive.

export type Entry = Record<string, unknown>;

/** A list entry that is a mapping, with its index in the list (the edit path needs it). */
export interface Indexed {
  index: number;
  entry: Entry;
}

export const isEntry = (value: unknown): value is Entry =>
  value !== null && typeof value === 'object' && !Array.isArray(value);

export function entryAt(data: unknown, key: string): Entry | null {
  const value = isEntry(data) ? data[key] : undefined;
  return isEntry(value) ? value : null;
}

/** The mappings of the list `key` of `data`; other items are left to the text. */
export function entriesAt(data: unknown, key: string): Indexed[] {
  const list = isEntry(data) ? data[key] : undefined;
  if (!Array.isArray(list)) return [];
  return list.flatMap((entry, index) => (isEntry(entry) ? [{ index, entry }] : []));
}

/** A value as a form field shows it. */
export function fieldText(value: unknown): string {
  if (value === undefined || value === null) return '';
  return plainText(value);
}

export const wholeNumber = (value: unknown): number | null =>
  typeof value === 'number' && Number.isInteger(value) ? value : null;

export type Parsed<T> = { value: T; error?: undefined } | { value?: undefined; error: string };

export function parseWhole(text: string, min: number, max: number, what: string): Parsed<number> {
  if (!/^-?\d+$/.test(text)) return { error: `${what} is a whole number from ${min} to ${max}.` };
  const value = Number(text);
  if (value < min || value > max) return { error: `${what} is a whole number from ${min} to ${max}.` };
  return { value };
}

export function parseNumber(text: string, min: number, max: number, what: string): Parsed<number> {
  const value = text === '' ? Number.NaN : Number(text);
  if (!Number.isFinite(value)) return { error: `${what} is a number from ${min} to ${max}.` };
  if (value < min || value > max) return { error: `${what} is a number from ${min} to ${max}.` };
  return { value };
}

/** The edits that apply a form change; a form calls this with what the pilot changed. */
export type ApplyEdits = (edits: DocumentEdit[]) => void;

export interface FormProps {
  /** The plain value of the text (readable YAML). */
  data: unknown;
  readOnly: boolean;
  onEdits: ApplyEdits;
}
