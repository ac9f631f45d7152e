import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { paths } from '../../../lib/api-paths';
import { setKeptModel, type KeptModel } from '../../../lib/offline';
import type { Id } from '../../../types/api';
import type { SetupModelView } from '../../models/types';
import type { Page } from '../../../lib/paged';
import { listModelReviews } from '../../reviews/api/reviews';
import type { ReviewSummary } from '../../reviews/types';

/** The revision a pilot flies from: the newest one a review approved, else the latest. */
async function revisionToKeep(model: SetupModelView): Promise<{ id: Id; number: number; approved: boolean } | null> {
  let approved: ReviewSummary | undefined;
  // Every page: an older review may have approved a higher revision than a newer one did.
  for (let offset: number | null = 0; offset !== null;) {
    const page: Page<ReviewSummary> = await listModelReviews(model.id, offset);
    for (const review of page.items)
      if (review.state === 'approved' && (!approved || review.revision.number > approved.revision.number))
        approved = review;
    offset = page.nextOffset;
  }
  if (approved) return { id: approved.revision.id, number: approved.revision.number, approved: true };
  return model.latest ? { id: model.latest.id, number: model.latest.number, approved: false } : null;
}

/**
 * Reads, with the network, every answer the model's Overview and Field sheet need for its
 * latest revision and for the newest approved one, so the service worker saves them and
 * they open at the field with no signal even if they were never opened here.
 */
export async function keepForField(modelId: Id): Promise<KeptModel & { approved: boolean }> {
  const model = (await api.get<SetupModelView>(paths.model(modelId))).data;
  const kept = await revisionToKeep(model);
  if (!kept) throw new Error('This model has no revision to keep yet.');
  const revisions = new Set([kept.id, model.latest?.id].filter((id): id is Id => Boolean(id)));
  await Promise.all([
    api.get(paths.modelRevisionNumber(modelId, kept.number)),
    ...[...revisions].flatMap((id) => [api.get(paths.revision(id)), api.get(paths.revisionFieldSheet(id))]),
  ]);
  const entry = { modelId, revisionId: kept.id, revisionNumber: kept.number, savedAt: new Date().toISOString() };
  setKeptModel(modelId, entry);
  return { ...entry, approved: kept.approved };
}

export function useKeepForField(modelId: Id) {
  return useMutation({ mutationFn: () => keepForField(modelId) });
}
