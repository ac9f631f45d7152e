import { QueryTypes, type Transaction } from 'sequelize';
import type { SourceUpdates } from '@shared/contract/provenance';
import { diffSetups } from '@shared/diff';
import { mergeSetups, type MergeResult, type MergeSide } from '@shared/lineage/merge-setups';
import { NotFound } from '../errors';
import { Revision, SetupModel } from '../models';

/** The three sides of a fork's merge with its source. */
export interface MergeSides {
  source: SetupModel;
  /** The source revision the fork was made from or last took in. */
  base: Revision;
  /** The fork's latest revision. */
  ours: Revision;
  /** The source's latest revision. */
  theirs: Revision;
}

/**
 * The fork's source model and the three revisions a merge needs. The base is the
 * source revision named by the fork's newest `fork` or `merge` revision, so each merge
 * starts where the previous one ended.
 */
export async function mergeSides(fork: SetupModel, transaction?: Transaction): Promise<MergeSides> {
  if (!fork.forkedFromRevisionId)
    throw new NotFound('This model is not a fork: it has no source to take changes from.', { code: 'not-a-fork' });
  const [lineage] = await Revision.sequelize!.query<{ source_revision_id: string }>(
    `SELECT source_revision_id FROM revisions
      WHERE model_id = $model AND origin IN ('fork', 'merge') ORDER BY number DESC LIMIT 1`,
    { bind: { model: fork.id }, type: QueryTypes.SELECT, transaction },
  );
  const baseId = lineage?.source_revision_id ?? fork.forkedFromRevisionId;
  const [base, ours] = await Promise.all([
    Revision.findByPk(baseId, { transaction }),
    Revision.findOne({ where: { modelId: fork.id }, order: [['number', 'DESC']], transaction }),
  ]);
  const source = base ? await SetupModel.findByPk(base.modelId, { transaction }) : null;
  if (!base || !ours || !source) throw new NotFound('The source of this fork is gone.', { code: 'source-not-found' });
  const theirs = await Revision.findOne({ where: { modelId: source.id }, order: [['number', 'DESC']], transaction });
  return { source, base, ours, theirs: theirs ?? base };
}

export function mergeOf(sides: MergeSides, resolutions?: Readonly<Record<string, MergeSide>>): MergeResult {
  return mergeSetups(sides.base.document, sides.ours.document, sides.theirs.document, resolutions);
}

/** What the GET answers: how far behind the fork is, what the source changed, and the conflicts. */
export function presentSourceUpdates(sides: MergeSides): SourceUpdates {
  const { source, base, ours, theirs } = sides;
  const behind = theirs.number - base.number;
  return {
    source: { model_id: source.id, revision_id: theirs.id, number: theirs.number, name: source.name },
    base: { revision_id: base.id, number: base.number },
    ours: { revision_id: ours.id, number: ours.number },
    behind,
    changes: behind > 0 ? diffSetups(base.document, theirs.document).changes : [],
    conflicts: behind > 0 ? mergeOf(sides).conflicts : [],
  };
}
