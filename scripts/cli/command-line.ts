import { parseArgs } from 'node:util';
import type { Finding } from '@shared/findings';
import { failUnreadable } from './read-setup-file';

// The arguments every command-line tool takes (docs/format.md, "Command line"): its files,
// --json, for the bench view --set CONTROL=VALUE and --lost RECEIVER, for the checks --rules RULES.yaml;
// anything else is exit 2 with the usage.

export type CommandLine =
  | { ok: true; json: boolean; files: string[]; sets: string[]; lost: string[]; rules?: string }
  | { ok: false; exitCode: 2 };

const COUNT_WORDS: Record<number, string> = { 1: 'one file', 2: 'two files' };

export function readCommandLine(
  argv: string[],
  {
    usage,
    files: count,
    takesSet = false,
    takesRules = false,
  }: { usage: string; files: 1 | 2; takesSet?: boolean; takesRules?: boolean },
): CommandLine {
  // Known before parsing, so that even refused arguments are answered in JSON when asked.
  let json = argv.includes('--json');
  let files: string[];
  let sets: string[];
  let lost: string[];
  let rules: string | undefined;
  try {
    const parsed = parseArgs({
      args: argv,
      options: takesSet
        ? {
            json: { type: 'boolean' },
            set: { type: 'string', multiple: true },
            lost: { type: 'string', multiple: true },
          }
        : takesRules
          ? { json: { type: 'boolean' }, rules: { type: 'string' } }
          : { json: { type: 'boolean' } },
      allowPositionals: true,
      strict: true,
    });
    json = parsed.values.json === true;
    files = parsed.positionals;
    sets = (parsed.values as { set?: string[] }).set ?? [];
    lost = (parsed.values as { lost?: string[] }).lost ?? [];
    rules = (parsed.values as { rules?: string }).rules;
  } catch (error) {
    return { ok: false, exitCode: failUnreadable(json, `${(error as Error).message}\n${usage}`) };
  }
  if (files.length !== count)
    return {
      ok: false,
      exitCode: failUnreadable(json, `expected ${COUNT_WORDS[count]}, got ${files.length}\n${usage}`),
    };
  return { ok: true, json, files, sets, lost, ...(rules !== undefined ? { rules } : {}) };
}

/** One finding as a line of the human output: where, how bad, which check, what. */
export function findingLine(finding: Pick<Finding, 'line' | 'column' | 'severity' | 'rule' | 'message'>): string {
  return `${finding.line}:${finding.column}  ${finding.severity}  ${finding.rule}  ${finding.message}`;
}
