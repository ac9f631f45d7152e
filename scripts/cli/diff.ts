import { analyzeSetup } from '@shared/analyze';
import { compareRevisions, type CompareSide } from '@shared/diff';
import { CHANGE_KINDS } from '@shared/diff/types';
import { readCommandLine } from './command-line';
import { failUnreadable, readSetupFile } from './read-setup-file';

// `npm run --silent diff -- OLD NEW [--json]` (docs/format.md, "Command line"): what changed
// between two setup files. Exit 0 when both files are readable, 2 otherwise. A file
// that parses but breaks the schema is readable: its changes are listed like any other.
// The JSON adds what the API compare gives: outputs_delta, findings_delta and
// change_findings (outputs_delta and change_findings null when a side breaks the schema).

const USAGE = 'usage: npm run --silent diff -- OLD.yaml NEW.yaml [--json]';

type Read = { ok: true; side: CompareSide } | { ok: false; message: string };

function readSetup(path: string): Read {
  const file = readSetupFile(path);
  if (!file.ok) return file;
  const analysis = analyzeSetup(file.text);
  if (analysis.readable)
    return {
      ok: true,
      side: { text: file.text, data: analysis.data, findings: analysis.findings, setup: analysis.setup },
    };
  const first = analysis.findings[0];
  return {
    ok: false,
    message: first ? `${path}:${first.line}:${first.column}: ${first.message}` : `${path}: not a setup document`,
  };
}

function main(argv: string[]): number {
  const args = readCommandLine(argv, { usage: USAGE, files: 2 });
  if (!args.ok) return args.exitCode;
  const { json, files } = args;

  const before = readSetup(files[0]);
  if (!before.ok) return failUnreadable(json, before.message);
  const after = readSetup(files[1]);
  if (!after.ok) return failUnreadable(json, after.message);

  const comparison = compareRevisions(before.side, after.side);
  const { changes, counts } = comparison;
  if (json) {
    const out = changes.map(({ kind, path, before: was, after: now, summary }) => ({
      kind,
      path,
      before: was,
      after: now,
      summary,
    }));
    const { outputs_delta, findings_delta, change_findings } = comparison;
    process.stdout.write(
      `${JSON.stringify({ changes: out, counts, outputs_delta, findings_delta, change_findings })}\n`,
    );
    return 0;
  }
  const lines = changes.map((change) => `${change.kind.padEnd(8)} ${change.summary}    [${change.path}]`);
  if (lines.length === 0) lines.push('No changes.');
  for (const delta of comparison.outputs_delta ?? []) lines.push(`moves    ${delta.summary}`);
  for (const finding of comparison.change_findings ?? [])
    lines.push(`${finding.severity.padEnd(8)} ${finding.rule}  ${finding.message}`);
  const total = changes.length;
  lines.push(
    '',
    `${total} change${total === 1 ? '' : 's'}: ${CHANGE_KINDS.map((kind) => `${counts[kind]} ${kind}`).join(', ')}`,
  );
  process.stdout.write(`${lines.join('\n')}\n`);
  return 0;
}

process.exitCode = main(process.argv.slice(2));
