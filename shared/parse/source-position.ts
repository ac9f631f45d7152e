import { isAlias, isMap, isScalar, isSeq, type Document, type LineCounter, type Node } from 'yaml';
import { plainText } from './plain-text';
import type { PathStep } from './semantic-path';

export interface SourcePosition {
  line: number;
  column: number;
}

type AnyNode = Node | null | undefined;

function startOf(node: AnyNode): number | null {
  return node && node.range ? node.range[0] : null;
}

function scalarText(node: unknown): string | null {
  return isScalar(node) && node.value !== null && node.value !== undefined ? plainText(node.value) : null;
}

/**
 * Where the node named by `steps` starts in the source. A member of a mapping is
 * located at its key, a list item at the item. When a step cannot be followed (a
 * missing field, a list entry that is not there), the nearest enclosing node found so
 * far is used.
 */
export function locate(document: Document, lineCounter: LineCounter, steps: readonly PathStep[]): SourcePosition {
  let node: AnyNode = document.contents;
  let offset = startOf(node) ?? 0;
  for (const step of steps) {
    if (isAlias(node)) node = node.resolve(document);
    let next: AnyNode;
    let at: number | null;
    if ('key' in step) {
      if (!isMap(node)) break;
      const pair = node.items.find((candidate) => scalarText(candidate.key) === step.key);
      if (!pair) break;
      at = startOf(pair.key as AnyNode);
      next = pair.value as AnyNode;
    } else if ('index' in step) {
      if (!isSeq(node)) break;
      next = node.items[step.index] as AnyNode;
      at = startOf(next);
    } else {
      if (!isSeq(node)) break;
      next = node.items.find((item) => {
        const entry = isAlias(item) ? item.resolve(document) : item;
        if (!isMap(entry)) return false;
        const pair = entry.items.find((candidate) => scalarText(candidate.key) === step.match);
        return pair !== undefined && scalarText(pair.value) === step.value;
      }) as AnyNode;
      at = startOf(next);
    }
    if (at === null) break;
    offset = at;
    node = next;
  }
  const { line, col } = lineCounter.linePos(offset);
  return { line, column: col };
}
