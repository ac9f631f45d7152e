// An unsaved edit, kept per model in this browser tab's sessionStorage so that leaving
// the editor (or reloading) does not lose it. It remembers the revision the edit
// started from: saving it later still names that base, and a newer revision meanwhile
// is shown rather than silently taken.

export interface Draft {
  baseId: string;
  baseNumber: number;
  text: string;
}

const keyFor = (modelId: string) => `bindery:draft:${modelId}`;

function isDraft(value: unknown): value is Draft {
  const draft = value as Partial<Draft> | null;
  return (
    typeof draft === 'object' &&
    draft !== null &&
    typeof draft.baseId === 'string' &&
    typeof draft.baseNumber === 'number' &&
    typeof draft.text === 'string'
  );
}

export function loadDraft(modelId: string): Draft | null {
  try {
    const raw = sessionStorage.getItem(keyFor(modelId));
    if (!raw) return null;
    const parsed: unknown = JSON.parse(raw);
    return isDraft(parsed) ? parsed : null;
  } catch {
    return null;
  }
}

/** False when the browser refused to store it (storage full or disabled). */
export function saveDraft(modelId: string, draft: Draft): boolean {
  try {
    sessionStorage.setItem(keyFor(modelId), JSON.stringify(draft));
    return true;
  } catch {
    return false;
  }
}

export function clearDraft(modelId: string): void {
  try {
    sessionStorage.removeItem(keyFor(modelId));
  } catch {
    // Storage that cannot be reached holds no draft to clear.
  }
}
