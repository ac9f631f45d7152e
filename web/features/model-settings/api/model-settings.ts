import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { paths } from '../../../lib/api-paths';
import type { Id } from '../../../types/api';
import { modelQueryKey } from '../../models/api/get-model';
import { hangarQueryKey } from '../../models/api/list-models';
import { revisionsQueryKey } from '../../models/api/list-revisions';
import type { SavedRevision, SetupModelView } from '../../models/types';

export interface Renamed {
  model: SetupModelView;
  /** The revision that carries the new `model.name`; null when the text needed no change. */
  revision: SavedRevision | null;
}

export async function renameModel(modelId: Id, name: string): Promise<Renamed> {
  const answer = await api.patch<SetupModelView>(paths.model(modelId), { name });
  const revision = (answer as { revision?: SavedRevision | null }).revision ?? null;
  return { model: answer.data, revision };
}

export async function setArchived(modelId: Id, archived: boolean): Promise<SetupModelView> {
  return (await api.post<SetupModelView>(paths.modelArchive(modelId, archived ? 'archive' : 'unarchive'))).data;
}

/** A rename or an archive changes the model page, its history (a rename saves a revision) and the hangar. */
function useRefresh(model: Pick<SetupModelView, 'id' | 'workspace_id'>) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: modelQueryKey(model.id) }),
      queryClient.invalidateQueries({ queryKey: revisionsQueryKey(model.id) }),
      queryClient.invalidateQueries({ queryKey: hangarQueryKey(model.workspace_id) }),
    ]);
}

export function useRenameModel(model: Pick<SetupModelView, 'id' | 'workspace_id'>) {
  const refresh = useRefresh(model);
  return useMutation({ mutationFn: (name: string) => renameModel(model.id, name), onSuccess: () => refresh() });
}

export function useSetArchived(model: Pick<SetupModelView, 'id' | 'workspace_id'>) {
  const refresh = useRefresh(model);
  return useMutation({
    mutationFn: (archived: boolean) => setArchived(model.id, archived),
    onSuccess: () => refresh(),
  });
}
