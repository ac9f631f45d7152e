import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import { modelQueryKey } from '../../models/api/get-model';
import { revisionsQueryKey } from '../../models/api/list-revisions';
import type { SavedRevision } from '../../models/types';
import { paths } from '../../../lib/api-paths';

export interface SaveRevisionInput {
  /** The number of the revision the edit started from; the server refuses a stale one with 409. */
  base: number;
  message: string;
  yaml: string;
}

export async function saveRevision(modelId: Id, input: SaveRevisionInput): Promise<SavedRevision> {
  return (await api.post<SavedRevision>(paths.modelRevisions(modelId), input)).data;
}

/** What a 409 `stale-base` answer names: the revision saved meanwhile. */
export interface StaleBase {
  latest: number;
  latestId: Id | null;
}

export function staleBaseOf(details: unknown): StaleBase | null {
  const value = details as { latest?: unknown; latest_id?: unknown } | null;
  if (!value || typeof value.latest !== 'number') return null;
  return { latest: value.latest, latestId: typeof value.latest_id === 'string' ? value.latest_id : null };
}

export function useSaveRevision(modelId: Id) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SaveRevisionInput) => saveRevision(modelId, input),
    onSettled: () => {
      // Saved or refused as stale, the model's latest revision is news either way.
      void queryClient.invalidateQueries({ queryKey: modelQueryKey(modelId) });
      void queryClient.invalidateQueries({ queryKey: revisionsQueryKey(modelId) });
    },
  });
}
