import { parseSemanticPath } from '@shared/parse/semantic-path';
import { parseYaml } from '@shared/parse/parse-yaml';
import { locate } from '@shared/parse/source-position';
import type { CommentThread } from '@shared/contract/review';

/** An open comment thread placed on the line of the text where its setting now is. */
export interface CommentLine {
  line: number;
  threads: CommentThread[];
}

/**
 * The lines of `text` that open threads are anchored to, by their setting's identity
 * path, so a thread follows its pin or mix when lines move above it. Threads on the
 * whole revision, or whose setting the text no longer has, get no line.
 */
export function commentLines(text: string, threads: readonly CommentThread[]): CommentLine[] {
  const anchored = threads.filter((thread) => thread.path !== null && !thread.resolved);
  if (anchored.length === 0) return [];
  const parsed = parseYaml(text);
  if (!parsed.readable || !parsed.document) return [];
  const byLine = new Map<number, CommentThread[]>();
  for (const thread of anchored) {
    const steps = parseSemanticPath(thread.path!);
    if (steps.length === 0) continue;
    const whole = locate(parsed.document, parsed.lineCounter, steps);
    // locate stops at the nearest enclosing node when a step is missing: a thread whose
    // setting is gone would land on its parent list, so it is placed only when the
    // last step's own parent is found further down than the list that holds it.
    const parent = locate(parsed.document, parsed.lineCounter, steps.slice(0, -1));
    if (steps.length > 1 && whole.line === parent.line && whole.column === parent.column) continue;
    byLine.set(whole.line, [...(byLine.get(whole.line) ?? []), thread]);
  }
  return [...byLine.entries()].sort((a, b) => a[0] - b[0]).map(([line, list]) => ({ line, threads: list }));
}
