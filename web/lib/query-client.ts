import { QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError, isUnauthorized } from './api-client';

// The session query's key lives here so any query that meets a 401 can send the
// session to be checked again, and the app frame then returns the user to sign-in.
export const SESSION_QUERY_KEY = ['session', 'me'] as const;

export function createQueryClient(): QueryClient {
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({
      onError: (error, query) => {
        if (isUnauthorized(error) && query.queryKey[0] !== SESSION_QUERY_KEY[0]) {
          void client.invalidateQueries({ queryKey: SESSION_QUERY_KEY });
        }
      },
    }),
    // 'always': without a signal a read is still asked, since the service worker answers
    // it from the copy this device saved (or it fails with the offline message), and a
    // write is sent and refused at once with the message that it needs the network. The
    // default ('online') holds both back from the moment the browser says the signal
    // went, so a screen opened at the field waited for ever on a copy it had.
    defaultOptions: {
      queries: {
        networkMode: 'always',
        staleTime: 30_000,
        refetchOnWindowFocus: false,
        // A 4xx answer will not change by asking again; a dropped connection might.
        retry: (failureCount, error) => {
          if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
          return failureCount < 2;
        },
      },
      mutations: { retry: false, networkMode: 'always' },
    },
  });
  return client;
}
