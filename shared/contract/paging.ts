// How every list the API answers a page at a time says where the page sits:
// `{ data: [...], pagination: { limit, offset, total } }`. The history of a model
// pages by revision number instead (`next_before`), since it only grows at one end.
export interface OffsetPagination {
  /** How many the page was asked to hold. */
  limit: number;
  /** How many came before the page. */
  offset: number;
  /** How many there are in all. */
  total: number;
}

/** The offset of the next page, or null when this page reached the end. */
export function nextOffset(pagination: OffsetPagination, received: number): number | null {
  const end = pagination.offset + received;
  return received > 0 && end < pagination.total ? end : null;
}
