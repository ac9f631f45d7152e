import { useCallback } from 'react';
import { useSearchParams } from 'react-router-dom';

/**
 * The address's query, and `update` to set some of its keys (null or '' removes one)
 * in place: a search box or filter changes the address as it is used, without leaving a
 * history entry behind for every key press.
 */
export function useQueryParams() {
  const [params, setParams] = useSearchParams();
  const update = useCallback(
    (changes: Record<string, string | null>) =>
      setParams(
        (current) => {
          const next = new URLSearchParams(current);
          for (const [key, value] of Object.entries(changes)) {
            if (value) next.set(key, value);
            else next.delete(key);
          }
          return next;
        },
        { replace: true },
      ),
    [setParams],
  );
  return [params, update] as const;
}
