import { analyzeSetup } from '../../shared/analyze';
import { diffSetups } from '../../shared/diff';
import { CHANGE_KINDS } from '../../shared/diff/types';
import { readCommandLine } from './command-line';
import { failUnreadable, readSetupFile } from './read-setup-file';

// `npm run --silent diff -- OLD NEW [--json]` (docs/format.md, "Command line"): what changed
// between two setup files. Exit 0 when both files are readable, 2 otherwise. A file
// that parses but breaks the schema is readable: its changes are listed like any other.

const USAGE = 'usage: npm run --silent diff -- OLD.yaml NEW.yaml [--json]';

type Read = { ok: true; data: unknown } | { ok: false; message: string };

function readSetup(path: string): Read {
  const file = readSetupFile(path);
  if (!file.ok) return file;
  const analysis = analyzeSetup(file.text);
  if (analysis.readable) return { ok: true, data: analysis.data };
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

  const { changes, counts } = diffSetups(before.data, after.data);
  if (json) {
    const out = changes.map(({ kind, path, before: was, after: now, summary }) => ({
      kind,
      path,
      before: was,
      after: now,
      summary,
    }));
    process.stdout.write(`${JSON.stringify({ changes: out, counts })}\n`);
    return 0;
  }
  const lines = changes.map((change) => `${change.kind.padEnd(8)} ${change.summary}    [${change.path}]`);
  if (lines.length === 0) lines.push('No changes.');
  const total = changes.length;
  lines.push(
    '',
    `${total} change${total === 1 ? '' : 's'}: ${CHANGE_KINDS.map((kind) => `${counts[kind]} ${kind}`).join(', ')}`,
  );
  process.stdout.write(`${lines.join('\n')}\n`);
  return 0;
}

process.exitCode = main(process.argv.slice(2));
