import type { $ZodIssue } from 'zod/v4/core';
import { setupSchema, type Setup } from '../format/schema';
import { plainText } from '../parse/plain-text';
import { toSemanticPath, type DataPath } from '../parse/semantic-path';
import type { CheckResult, ReadCheck } from './check';
import { FIELD_DESCRIPTIONS, fieldPattern } from './field-descriptions';

export const schema: ReadCheck = {
  id: 'schema',
  severity: 'error',
  description: 'A field is missing, has the wrong type or is outside the ranges of the format.',
};

function valueAt(data: unknown, path: DataPath): { found: boolean; value: unknown } {
  let value: unknown = data;
  for (const step of path) {
    if (value === null || typeof value !== 'object') return { found: false, value: undefined };
    const container = value as Record<string | number, unknown>;
    if (!Object.prototype.hasOwnProperty.call(container, step)) return { found: false, value: undefined };
    value = container[step];
  }
  return { found: true, value };
}

function shown(value: unknown): string {
  if (value === null) return 'empty';
  if (Array.isArray(value)) return value.length === 0 ? 'an empty list' : `a list of ${value.length}`;
  if (typeof value === 'object') return 'a mapping';
  if (typeof value === 'string') {
    const text = value.length > 40 ? `${value.slice(0, 37)}...` : value;
    return `the text ${JSON.stringify(text)}`;
  }
  if (typeof value === 'number' && !Number.isFinite(value)) return 'not a finite number';
  return plainText(value);
}

function describeIssue(issue: $ZodIssue, data: unknown): CheckResult {
  const at = issue.path.filter((step): step is string | number => typeof step !== 'symbol');
  const path = toSemanticPath(data, at);
  const subject = path === '' ? 'The document' : path;
  const key = at.length > 0 ? String(at[at.length - 1]) : '';
  const must = FIELD_DESCRIPTIONS[fieldPattern(at)];
  const { found, value } = valueAt(data, at);

  if (!found && typeof key === 'string' && key !== '' && typeof at[at.length - 1] === 'string') {
    const parent = toSemanticPath(data, at.slice(0, -1)) || 'the top level';
    return {
      message: `${subject} is missing${must ? `; it must be ${must}` : ''}.`,
      hint: `Add ${key} to ${parent}.`,
      path,
      at,
    };
  }
  if (issue.code === 'invalid_type' && issue.expected === 'never') {
    return {
      message: `${subject} is set, but only switches have positions.`,
      hint: 'Remove positions, or make the control a switch.',
      path,
      at,
    };
  }
  if (must) {
    return {
      message: `${subject} is ${shown(value)}, but it must be ${must}.`,
      hint: `Change ${path || 'the document'} to ${must}.`,
      path,
      at,
    };
  }
  return { message: `${subject}: ${issue.message}.`, hint: 'Correct the value as the format describes.', path, at };
}

/** Validates readable data against the format, explaining each problem in words. */
export function validateSetup(data: unknown): { setup: Setup | null; results: CheckResult[] } {
  const parsed = setupSchema.safeParse(data);
  if (parsed.success) return { setup: parsed.data, results: [] };
  const seen = new Set<string>();
  const results: CheckResult[] = [];
  for (const issue of parsed.error.issues) {
    const result = describeIssue(issue, data);
    if (seen.has(result.path)) continue;
    seen.add(result.path);
    results.push(result);
  }
  return { setup: null, results };
}
