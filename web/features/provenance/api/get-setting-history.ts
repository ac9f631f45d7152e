import { useInfiniteQuery } from '@tanstack/react-query';
import type { ProvenanceChange } from '@shared/contract/provenance';
import { paths } from '../../../lib/api-paths';
import { getPage, offsetPaging } from '../../../lib/paged';
import type { Id } from '../../../types/api';

const PAGE = 10;

/** Every revision that changed one setting, newest first, a page at a time; fetched once `enabled`. */
export function useSettingHistory(modelId: Id, path: string, enabled: boolean) {
  return useInfiniteQuery({
    queryKey: ['setting-history', modelId, path] as const,
    queryFn: ({ pageParam, signal }) =>
      getPage<ProvenanceChange>(
        paths.modelProvenanceHistory(modelId, { path, limit: PAGE, offset: pageParam }),
        pageParam,
        signal,
      ),
    ...offsetPaging,
    enabled,
  });
}
