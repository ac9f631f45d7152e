import { z } from 'zod';
import type { OffsetPagination } from '@shared/contract/paging';

// The one paging input of the API's lists (`?limit=&offset=`) and the pagination its
// answers carry (shared/contract/paging.ts). Lists that search or filter extend it.

export const MAX_PAGE = 200;

/** `limit` (1 to MAX_PAGE, `defaultLimit` when absent) and `offset` (0 when absent). */
export function pageInput(defaultLimit = 50) {
  return z.object({
    limit: z.coerce
      .number({ error: 'limit must be a number.' })
      .int('limit must be a whole number.')
      .min(1, 'limit is at least 1.')
      .max(MAX_PAGE, `limit is at most ${MAX_PAGE}.`)
      .default(defaultLimit),
    offset: z.coerce
      .number({ error: 'offset must be a number.' })
      .int('offset must be a whole number.')
      .min(0, 'offset is at least 0.')
      .max(2_147_483_647, 'offset is too large.')
      .default(0),
  });
}

export type PageInput = z.output<ReturnType<typeof pageInput>>;

export const pagination = (page: PageInput, total: number): OffsetPagination => ({
  limit: page.limit,
  offset: page.offset,
  total,
});
