import { parse } from 'yaml';
import { clubRulesSchema, DEFAULT_CLUB_RULES, loweredErrors, type ClubRules } from '@shared/rules/club-rules';
import { readSetupFile } from './read-setup-file';

// A club's rules file for `check --rules` (docs/format.md, "Club rules"): YAML in the
// shape `PUT /api/workspaces/:ws/rules` takes, so one file serves the command line and
// the workspace. `approvals` may be left out here: the checks do not use it.

export type RulesFile = { ok: true; rules: ClubRules } | { ok: false; message: string };

export function readClubRules(file: string): RulesFile {
  const read = readSetupFile(file);
  if (!read.ok) return { ok: false, message: read.message };
  let data: unknown;
  try {
    data = parse(read.text, { maxAliasCount: 100 });
  } catch (error) {
    return { ok: false, message: `${file}: not YAML (${(error as Error).message.split('\n')[0]})` };
  }
  const shaped =
    data && typeof data === 'object' && !Array.isArray(data)
      ? { approvals: DEFAULT_CLUB_RULES.approvals, ...data }
      : data;
  const result = clubRulesSchema.safeParse(shaped);
  if (!result.success) {
    const issue = result.error.issues[0];
    const where = issue.path.length > 0 ? `${issue.path.join('.')}: ` : '';
    return { ok: false, message: `${file}: not a club rules file (${where}${issue.message})` };
  }
  const lowered = loweredErrors(result.data.severities);
  if (lowered.length > 0)
    return { ok: false, message: `${file}: an error cannot be lowered or switched off: ${lowered.join(', ')}` };
  return { ok: true, rules: result.data };
}
