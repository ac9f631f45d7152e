import type { CST } from 'yaml';

export interface DeepNesting {
  depth: number;
  offset: number;
}

const COLLECTIONS = new Set(['block-map', 'block-seq', 'flow-collection']);

/**
 * Whether the parser's stack of open tokens holds more than `limit` collections. The
 * parser is watched after every lexeme, so a runaway of brackets or dashes
 * (`[[[[...`, `- - - - x`) is stopped as soon as it passes the limit, long before
 * the composer (which recurses once per level) would see it.
 */
export function findDeepNesting(stack: readonly CST.Token[], limit: number): DeepNesting | null {
  if (stack.length <= limit) return null;
  let depth = 0;
  for (const token of stack) {
    if (!COLLECTIONS.has(token.type)) continue;
    depth += 1;
    if (depth > limit) return { depth, offset: 'offset' in token ? token.offset : 0 };
  }
  return null;
}
