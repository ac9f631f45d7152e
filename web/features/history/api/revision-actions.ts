import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import { modelQueryKey } from '../../models/api/get-model';
import { revisionQueryKey } from '../../models/api/get-revision';
import { revisionsQueryKey } from '../../models/api/list-revisions';
import { hangarQueryKey } from '../../models/api/list-models';
import type { SavedRevision, SetupModelView } from '../../models/types';
import { paths } from '../../../lib/api-paths';

export interface RevertInput {
  modelId: Id;
  /** The revision whose content comes back. */
  number: number;
  /** The latest number as the screen knows it; the server refuses a stale one with 409. */
  base: number;
  message?: string;
}

export async function revertRevision({ modelId, ...body }: RevertInput): Promise<SavedRevision> {
  return (await api.post<SavedRevision>(paths.modelRevert(modelId), body)).data;
}

export interface TagsAnswer {
  revision_id: Id;
  number: number;
  tags: string[];
}

export async function addTag({ revisionId, name }: { revisionId: Id; name: string }): Promise<TagsAnswer> {
  return (await api.post<TagsAnswer>(paths.revisionTags(revisionId), { name })).data;
}

export async function removeTag({ revisionId, name }: { revisionId: Id; name: string }): Promise<TagsAnswer> {
  return (await api.delete<TagsAnswer>(paths.revisionTag(revisionId, name))).data;
}

/** A new revision or a tag changes the model's history and its hangar row. */
function useRefreshModel(model: Pick<SetupModelView, 'id' | 'workspace_id'>) {
  const queryClient = useQueryClient();
  return (revisionId?: Id) =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: modelQueryKey(model.id) }),
      queryClient.invalidateQueries({ queryKey: revisionsQueryKey(model.id) }),
      queryClient.invalidateQueries({ queryKey: hangarQueryKey(model.workspace_id) }),
      revisionId ? queryClient.invalidateQueries({ queryKey: revisionQueryKey(revisionId) }) : undefined,
    ]);
}

export function useRevert(model: Pick<SetupModelView, 'id' | 'workspace_id'>) {
  const refresh = useRefreshModel(model);
  // Settled, not only succeeded: a 409 means the history moved on, and the screen should show it.
  return useMutation({ mutationFn: revertRevision, onSettled: () => refresh() });
}

export function useAddTag(model: Pick<SetupModelView, 'id' | 'workspace_id'>) {
  const refresh = useRefreshModel(model);
  return useMutation({ mutationFn: addTag, onSuccess: (answer) => refresh(answer.revision_id) });
}

export function useRemoveTag(model: Pick<SetupModelView, 'id' | 'workspace_id'>) {
  const refresh = useRefreshModel(model);
  return useMutation({ mutationFn: removeTag, onSuccess: (answer) => refresh(answer.revision_id) });
}
