import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { Revision } from '../../models/types';
import type { FieldSheet } from '../types';
import { paths } from '../../../lib/api-paths';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** `?revision=` names a revision by id or by its number in the model; absent means the latest. */
export async function resolveRevisionId(
  modelId: Id,
  param: string | null,
  latestId: Id | null,
  signal?: AbortSignal,
): Promise<Id | null> {
  if (!param) return latestId;
  if (UUID.test(param)) return param;
  if (!/^\d{1,10}$/.test(param)) return null;
  return (await api.get<Revision>(paths.modelRevisionNumber(modelId, param), signal)).data.id;
}

export async function getFieldSheet(revisionId: Id, signal?: AbortSignal): Promise<FieldSheet> {
  return (await api.get<FieldSheet>(paths.revisionFieldSheet(revisionId), signal)).data;
}

export function fieldSheetQueryOptions(modelId: Id, param: string | null, latestId: Id | null) {
  return queryOptions({
    // Which unit sits in which slot can change, so the sheet is refetched like any list.
    queryKey: ['field-sheets', modelId, param ?? 'latest', latestId],
    queryFn: async ({ signal }) => {
      const revisionId = await resolveRevisionId(modelId, param, latestId, signal);
      if (!revisionId) throw new Error(`“${param}” does not name a revision: use its number or its id.`);
      return getFieldSheet(revisionId, signal);
    },
  });
}

/** The sheet of the revision named in the address (or the latest). */
export function useFieldSheet(modelId: Id, param: string | null, latestId: Id | null, ready: boolean) {
  return useQuery({ ...fieldSheetQueryOptions(modelId, param, latestId), enabled: ready && modelId !== '' });
}

export const fieldSheetPdfUrl = (revisionId: Id) => paths.revisionFieldSheetPdf(revisionId);
