import { CST, Lexer } from 'yaml';

// The lexer emits marker tokens that stand for no source text.
const SYNTHETIC_TOKENS = new Set<string | null>(['doc-mode', 'flow-error-end', 'scalar']);

export interface DeepNesting {
  depth: number;
  offset: number;
}

/**
 * Finds nesting deeper than `limit` from the lexer's flat token stream, before the
 * composer builds (recursively) a node tree. Flow brackets nest without limit on one
 * line, and so do compact block indicators (`- - - x`, `? ? x`); nesting by
 * indentation costs a growing number of spaces per level, so within the size limit
 * it stays shallow enough for the composer and is measured on the node tree instead.
 */
export function findDeepNesting(text: string, limit: number): DeepNesting | null {
  let flowDepth = 0;
  let lineIndicators = 0;
  let offset = 0;
  for (const token of new Lexer().lex(text)) {
    const type = CST.tokenType(token);
    if (type === 'flow-seq-start' || type === 'flow-map-start') {
      flowDepth += 1;
      if (flowDepth > limit) return { depth: flowDepth, offset };
    } else if (type === 'flow-seq-end' || type === 'flow-map-end') {
      flowDepth = Math.max(0, flowDepth - 1);
    } else if (type === 'seq-item-ind' || type === 'explicit-key-ind') {
      lineIndicators += 1;
      if (lineIndicators > limit) return { depth: lineIndicators, offset };
    } else if (type === 'newline') {
      lineIndicators = 0;
    }
    if (!SYNTHETIC_TOKENS.has(type)) offset += token.length;
  }
  return null;
}
