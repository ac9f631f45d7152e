import { analyzeSetup } from '@shared/analyze';
import { countFindings } from '@shared/findings';
import { applyClubRules } from '@shared/rules/club-rules';
import { findingLine, readCommandLine } from './command-line';
import { readClubRules } from './read-club-rules';
import { failUnreadable, readSetupFile } from './read-setup-file';

// `npm run --silent check -- FILE [--rules RULES.yaml] [--json]` (docs/format.md, "Command
// line"): the findings, with a club's rules applied when given. Exit 0 readable without
// errors, 1 with errors (syntax and schema included), 2 unreadable (the rules file too).

const USAGE = 'usage: npm run --silent check -- FILE [--rules RULES.yaml] [--json]';

function plural(count: number, word: string): string {
  return `${count} ${word}${count === 1 ? '' : 's'}`;
}

function main(argv: string[]): number {
  const args = readCommandLine(argv, { usage: USAGE, files: 1, takesRules: true });
  if (!args.ok) return args.exitCode;
  const { json } = args;

  const file = readSetupFile(args.files[0]);
  if (!file.ok) return failUnreadable(json, file.message);

  const rules = args.rules === undefined ? null : readClubRules(args.rules);
  if (rules && !rules.ok) return failUnreadable(json, rules.message);

  const analysis = analyzeSetup(file.text);
  const findings = rules ? applyClubRules(analysis.findings, rules.rules) : analysis.findings;
  const counts = countFindings(findings);
  if (json) {
    const out = findings.map(({ rule, severity, message, hint, path, line, column, club_rule }) => ({
      rule,
      severity,
      message,
      hint,
      path,
      line,
      column,
      ...(club_rule ? { club_rule } : {}),
    }));
    process.stdout.write(
      `${JSON.stringify({ findings: out, errors: counts.errors, warnings: counts.warnings, infos: counts.infos })}\n`,
    );
  } else {
    const lines = findings.map(
      (finding) => findingLine(finding) + (finding.club_rule ? `  (${finding.club_rule})` : ''),
    );
    lines.push(
      `${file.file}: ${plural(counts.errors, 'error')}, ${plural(counts.warnings, 'warning')}, ${plural(counts.infos, 'info')}`,
    );
    process.stdout.write(`${lines.join('\n')}\n`);
  }
  return counts.errors > 0 ? 1 : 0;
}

process.exitCode = main(process.argv.slice(2));
