import type { Diagnostic } from '@codemirror/lint';
import type { Text } from '@codemirror/state';
import type { Finding } from '@shared/findings';

const CLOSING: Record<string, string> = { '{': '}', '[': ']' };

/**
 * Where a finding's underline ends: a finding points at the start of a node, so the
 * underline covers that node on its line: a bracketed entry to its closing bracket,
 * a plain value to the next separator, never past a comment.
 */
function spanEnd(line: string, start: number): number {
  const open = line[start];
  const close = CLOSING[open];
  if (close) {
    let depth = 0;
    for (let i = start; i < line.length; i += 1) {
      if (line[i] === open) depth += 1;
      else if (line[i] === close && --depth === 0) return i + 1;
    }
  }
  let end = start;
  while (end < line.length && !/[,{}[\]#]/.test(line[end])) end += 1;
  while (end > start && /\s/.test(line[end - 1])) end -= 1;
  return Math.max(end, Math.min(start + 1, line.length));
}

/** The editor's diagnostics for the findings of the text `doc` holds. */
export function findingDiagnostics(doc: Text, findings: readonly Finding[]): Diagnostic[] {
  return findings.map((finding) => {
    const line = doc.line(Math.min(Math.max(1, finding.line), doc.lines));
    const offset = Math.min(Math.max(0, finding.column - 1), line.length);
    const end = spanEnd(line.text, offset);
    return {
      from: line.from + offset,
      to: line.from + end,
      severity: finding.severity,
      source: finding.rule,
      message: `${finding.message} ${finding.hint}`.trim(),
    };
  });
}
