import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { api } from '../../../lib/api-client';
import { paths } from '../../../lib/api-paths';
import type { Id } from '../../../types/api';
import type { Revision } from '../types';
import { useRevision } from './get-revision';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * The revision a model screen shows: the one `?revision=` names (by its number, as
 * people write it, or by id), else the latest. A number is looked up once; the
 * revision itself never changes.
 */
export function useAddressedRevision(modelId: Id, latestId: Id | null | undefined) {
  const [params] = useSearchParams();
  const asked = params.get('revision');
  const byNumber = asked !== null && /^\d{1,9}$/.test(asked) ? asked : null;
  const number = useQuery({
    queryKey: ['models', modelId, 'revision-number', byNumber],
    queryFn: async ({ signal }) =>
      (await api.get<Revision>(paths.modelRevisionNumber(modelId, byNumber!), signal)).data.id,
    enabled: byNumber !== null && modelId !== '',
    staleTime: Infinity,
  });
  const invalid = asked !== null && byNumber === null && !UUID.test(asked);
  const id = asked === null ? latestId : byNumber !== null ? number.data : invalid ? null : asked;
  const revision = useRevision(id);
  return {
    /** What the address asked for, null for the latest. */
    asked,
    invalid,
    revision,
    /** Still finding out which revision it is. */
    pending: (byNumber !== null && number.isPending) || (Boolean(id) && revision.isPending),
    error: number.error ?? revision.error,
  };
}
