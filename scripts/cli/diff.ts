import { readFileSync, statSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { analyzeSetup } from '../../shared/analyze';
import { diffSetups } from '../../shared/diff';
import { CHANGE_KINDS } from '../../shared/diff/types';

// `npm run --silent diff -- OLD NEW [--json]` (FORMAT.md, "Command line"): what changed
// between two setup files. Exit 0 when both files are readable, 2 otherwise.

const USAGE = 'usage: npm run --silent diff -- OLD.yaml NEW.yaml [--json]';

class Unreadable extends Error {}

function readSetup(file: string): unknown {
  let text: string;
  try {
    if (!statSync(file).isFile()) throw new Unreadable(`${file}: not a file`);
    text = readFileSync(file, 'utf8');
  } catch (error) {
    if (error instanceof Unreadable) throw error;
    const code = (error as NodeJS.ErrnoException).code;
    throw new Unreadable(code === 'ENOENT' ? `${file}: no such file` : `${file}: cannot be read (${code ?? String(error)})`);
  }
  const analysis = analyzeSetup(text);
  if (!analysis.readable) {
    const first = analysis.findings[0];
    const where = first ? `:${first.line}:${first.column}: ${first.message}` : ': not a setup document';
    throw new Unreadable(`${file}${where}`);
  }
  return analysis.data;
}

function main(argv: string[]): number {
  let json = false;
  let files: string[];
  try {
    const parsed = parseArgs({ args: argv, options: { json: { type: 'boolean' } }, allowPositionals: true, strict: true });
    json = parsed.values.json ?? false;
    files = parsed.positionals;
  } catch (error) {
    return fail(argv.includes('--json'), `${(error as Error).message}\n${USAGE}`);
  }
  if (files.length !== 2) return fail(json, `expected two files, got ${files.length}\n${USAGE}`);

  let before: unknown;
  let after: unknown;
  try {
    before = readSetup(files[0]);
    after = readSetup(files[1]);
  } catch (error) {
    if (error instanceof Unreadable) return fail(json, error.message);
    throw error;
  }

  const { changes, counts } = diffSetups(before, after);
  if (json) {
    const out = changes.map(({ kind, path, before: was, after: now, summary }) => ({ kind, path, before: was, after: now, summary }));
    process.stdout.write(`${JSON.stringify({ changes: out, counts })}\n`);
    return 0;
  }
  const lines = changes.map((change) => `${change.kind.padEnd(8)} ${change.summary}    [${change.path}]`);
  if (lines.length === 0) lines.push('No changes.');
  const total = changes.length;
  lines.push('', `${total} change${total === 1 ? '' : 's'}: ${CHANGE_KINDS.map((kind) => `${counts[kind]} ${kind}`).join(', ')}`);
  process.stdout.write(`${lines.join('\n')}\n`);
  return 0;
}

// With --json the answer stays one JSON object on standard output, errors included.
function fail(json: boolean, message: string): number {
  if (json) process.stdout.write(`${JSON.stringify({ error: { message } })}\n`);
  else process.stderr.write(`${message}\n`);
  return 2;
}

process.exitCode = main(process.argv.slice(2));
