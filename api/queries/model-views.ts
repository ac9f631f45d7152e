import { Op, QueryTypes, type Transaction } from 'sequelize';
import { memberWorkspaceIds } from '../access/membership';
import { Revision, SetupModel, Tag, User } from '../models';
import type { Role } from '@shared/contract/roles';
import { presentModel, type ForkSource, type PresentedModel } from '../presenters/model';
import { reviewStateOf } from '../review-state';
import { approvedRevisions } from './approved-revisions';

const SUMMARY_ATTRIBUTES = { exclude: ['yamlText', 'document', 'findings'] };

/** The latest revision of each model (with its author), by model id; two index lookups per model. */
export async function latestRevisions(
  modelIds: readonly string[],
  transaction?: Transaction,
): Promise<Map<string, Revision>> {
  if (modelIds.length === 0) return new Map();
  const rows = await Revision.sequelize!.query<{ id: string }>(
    `SELECT latest.id FROM unnest($ids::uuid[]) AS m(id)
       CROSS JOIN LATERAL (SELECT r.id FROM revisions r WHERE r.model_id = m.id ORDER BY r.number DESC LIMIT 1) AS latest`,
    { bind: { ids: [...modelIds] }, type: QueryTypes.SELECT, transaction },
  );
  const revisions = await Revision.findAll({
    where: { id: rows.map((row) => row.id) },
    attributes: SUMMARY_ATTRIBUTES,
    include: [{ model: User, as: 'author', attributes: ['id', 'name'] }],
    transaction,
  });
  return new Map(revisions.map((revision) => [revision.modelId, revision]));
}

/** Where each forked model came from, and whether `user` may read the source's workspace. */
export async function forkSources(models: readonly SetupModel[], user: User): Promise<Map<string, ForkSource>> {
  const sourceIds = [
    ...new Set(models.map((model) => model.forkedFromRevisionId).filter((id): id is string => Boolean(id))),
  ];
  if (sourceIds.length === 0) return new Map();
  const [revisions, readable] = await Promise.all([
    Revision.findAll({
      where: { id: sourceIds },
      attributes: ['id', 'number', 'modelId'],
      include: [{ model: SetupModel, as: 'model', required: true }],
    }),
    memberWorkspaceIds(user.id),
  ]);
  const byId = new Map(revisions.map((revision) => [revision.id, revision]));
  const sources = new Map<string, ForkSource>();
  for (const model of models) {
    const revision = model.forkedFromRevisionId ? byId.get(model.forkedFromRevisionId) : undefined;
    if (revision?.model)
      sources.set(model.id, { revision, model: revision.model, readable: readable.has(revision.model.workspaceId) });
  }
  return sources;
}

/** Models as the hangar and the model page present them: latest revision, review state, lineage. */
export async function presentModels(models: readonly SetupModel[], role: Role, user: User): Promise<PresentedModel[]> {
  const [latest, sources, approved] = await Promise.all([
    latestRevisions(models.map((model) => model.id)),
    forkSources(models, user),
    approvedRevisions(models.map((model) => model.id)),
  ]);
  const states = await reviewStateOf([...latest.values()]);
  return models.map((model) => {
    const revision = latest.get(model.id) ?? null;
    return presentModel(model, {
      latest: revision,
      reviewState: (revision && states.get(revision.id)) || 'none',
      role,
      forkedFrom: sources.get(model.id) ?? null,
      approved: approved.get(model.id) ?? null,
    });
  });
}

export async function presentOneModel(model: SetupModel, role: Role, user: User): Promise<PresentedModel> {
  const [presented] = await presentModels([model], role, user);
  return presented;
}

/** Tag names per revision id. */
export async function tagsByRevision(revisionIds: readonly string[]): Promise<Map<string, string[]>> {
  const tags =
    revisionIds.length === 0
      ? []
      : await Tag.findAll({ where: { revisionId: { [Op.in]: [...revisionIds] } }, attributes: ['revisionId', 'name'] });
  const byRevision = new Map<string, string[]>();
  for (const tag of tags) byRevision.set(tag.revisionId, [...(byRevision.get(tag.revisionId) ?? []), tag.name]);
  return byRevision;
}

export { SUMMARY_ATTRIBUTES };
