import { createContext, useContext } from 'react';
import type { Session } from '../../../types/api';

/**
 * The session the app frame loaded, handed down so screens never see it vanish half
 * way through signing out, when the cache is emptied before the frame unmounts.
 */
export const SessionContext = createContext<Session | null>(null);

export function useSession(): Session {
  const session = useContext(SessionContext);
  if (!session) throw new Error('useSession is for screens inside the signed-in app frame');
  return session;
}
