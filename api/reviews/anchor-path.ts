import { parseSemanticPath, type PathStep } from '@shared/parse/semantic-path';

// Comments anchor to semantic paths (receivers[id=wing].map[pin=3]), which name places
// by identity rather than position; a comment is carried to a later revision while its
// path still leads somewhere in that revision's document.

const PLAIN_KEY = /^[A-Za-z0-9_-]+$/;

function formatSteps(steps: readonly PathStep[]): string {
  let out = '';
  for (const step of steps) {
    if ('index' in step) out += `[${step.index}]`;
    else if ('match' in step) out += `[${step.match}=${step.value}]`;
    else if (PLAIN_KEY.test(step.key)) out += out === '' ? step.key : `.${step.key}`;
    else out += `[${JSON.stringify(step.key)}]`;
  }
  return out;
}

/** The path's steps when it is written the way Bindery writes paths, else null. */
export function readAnchor(path: string): PathStep[] | null {
  const steps = parseSemanticPath(path);
  if (steps.length === 0 || formatSteps(steps) !== path) return null;
  return steps;
}

const identityOf = (value: unknown): string | null =>
  typeof value === 'number' && Number.isFinite(value) ? String(value) : typeof value === 'string' ? value : null;

/** Whether the path leads to a value in the document. */
export function anchorExists(document: unknown, path: string): boolean {
  const steps = readAnchor(path);
  if (!steps) return false;
  let value: unknown = document;
  for (const step of steps) {
    if ('key' in step) {
      if (
        value === null ||
        typeof value !== 'object' ||
        Array.isArray(value) ||
        !Object.prototype.hasOwnProperty.call(value, step.key)
      )
        return false;
      value = (value as Record<string, unknown>)[step.key];
    } else if ('index' in step) {
      if (!Array.isArray(value) || step.index >= value.length) return false;
      value = value[step.index];
    } else {
      if (!Array.isArray(value)) return false;
      value = value.find(
        (item) =>
          item !== null &&
          typeof item === 'object' &&
          identityOf((item as Record<string, unknown>)[step.match]) === step.value,
      );
      if (value === undefined) return false;
    }
  }
  return true;
}
