import type { Id } from '../../types/api';

// Remembered so screens outside a workspace's URL (a model, the outbox) still know
// which workspace the user came from, and the next visit opens it again.
const KEY = 'bindery.last-workspace';

export function rememberWorkspace(id: Id): void {
  try {
    localStorage.setItem(KEY, id);
  } catch {
    // Storage can be switched off; the app then simply opens the first workspace.
  }
}

export function lastWorkspaceId(): string | null {
  try {
    return localStorage.getItem(KEY);
  } catch {
    return null;
  }
}
