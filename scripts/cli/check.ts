import { analyzeSetup } from '@shared/analyze';
import { findingLine, readCommandLine } from './command-line';
import { failUnreadable, readSetupFile } from './read-setup-file';

// `npm run --silent check -- FILE [--json]` (docs/format.md, "Command line"): the findings.
// Exit 0 readable without errors, 1 with errors (syntax and schema included), 2 unreadable.

const USAGE = 'usage: npm run --silent check -- FILE [--json]';

function plural(count: number, word: string): string {
  return `${count} ${word}${count === 1 ? '' : 's'}`;
}

function main(argv: string[]): number {
  const args = readCommandLine(argv, { usage: USAGE, files: 1 });
  if (!args.ok) return args.exitCode;
  const { json } = args;

  const file = readSetupFile(args.files[0]);
  if (!file.ok) return failUnreadable(json, file.message);

  const { findings, counts } = analyzeSetup(file.text);
  if (json) {
    const out = findings.map(({ rule, severity, message, hint, path, line, column }) => ({
      rule,
      severity,
      message,
      hint,
      path,
      line,
      column,
    }));
    process.stdout.write(
      `${JSON.stringify({ findings: out, errors: counts.errors, warnings: counts.warnings, infos: counts.infos })}\n`,
    );
  } else {
    const lines = findings.map(findingLine);
    lines.push(
      `${file.file}: ${plural(counts.errors, 'error')}, ${plural(counts.warnings, 'warning')}, ${plural(counts.infos, 'info')}`,
    );
    process.stdout.write(`${lines.join('\n')}\n`);
  }
  return counts.errors > 0 ? 1 : 0;
}

process.exitCode = main(process.argv.slice(2));
