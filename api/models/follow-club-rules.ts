import type { Transaction } from 'sequelize';
import { countFindings, type Finding } from '@shared/findings';
import { applyClubRules } from '@shared/rules/club-rules';
import { rulesByModel } from './ClubRules';
import { Revision } from './Revision';

/**
 * Gives loaded revisions the findings and counts of the club rules in force now in
 * their workspace (in memory only: the stored findings keep the format's severities,
 * and history is never rewritten). Every read of a revision goes through here (the
 * Revision model's afterFind hook; reads that include revisions call it themselves), so
 * checks, compares, reviews, hangar counts and field sheets all follow the same rules.
 * A revision read without its findings gets them read once more when its club has
 * rules that change a severity.
 */
export async function followClubRules(revisions: readonly Revision[], transaction?: Transaction | null): Promise<void> {
  // Raw reads (`raw: true`) give plain rows, not instances: those are left as read.
  const subjects = revisions.filter(
    (revision) => revision instanceof Revision && typeof revision.get('modelId') === 'string',
  );
  if (subjects.length === 0) return;
  const rules = await rulesByModel(
    subjects.map((revision) => revision.modelId),
    transaction ?? undefined,
  );
  const affected = subjects.filter((revision) => Object.keys(rules.get(revision.modelId)?.severities ?? {}).length > 0);
  if (affected.length === 0) return;
  const missing = affected.filter((revision) => revision.get('findings') === undefined);
  const stored = new Map<string, Finding[]>();
  if (missing.length > 0) {
    const rows = await Revision.findAll({
      where: { id: missing.map((revision) => revision.id) },
      attributes: ['id', 'findings'],
      transaction: transaction ?? undefined,
    });
    for (const row of rows) stored.set(row.id, row.findings);
  }
  for (const revision of affected) {
    const findings = applyClubRules(stored.get(revision.id) ?? revision.findings, rules.get(revision.modelId)!);
    const counts = countFindings(findings);
    if (!stored.has(revision.id)) revision.setDataValue('findings', findings);
    revision.setDataValue('errorCount', counts.errors);
    revision.setDataValue('warningCount', counts.warnings);
    revision.setDataValue('infoCount', counts.infos);
  }
}
