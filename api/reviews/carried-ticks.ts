import { canonicalJson } from '@shared/canonical/content-hash';
import { coveredWords, PRE_MAIDEN_CHECKLIST, type ChecklistItem } from './checklist';

// A reviewer's tick says "checked on the model as this setup has it". When the next
// revision leaves every part an item depends on exactly as it was, the check still
// holds and is carried over, saying so; when any of those parts changed, the item
// starts unticked again. Items made before each flight never carry.

const part = (document: unknown, key: string): string => {
  const value =
    document && typeof document === 'object' && !Array.isArray(document)
      ? (document as Record<string, unknown>)[key]
      : undefined;
  return canonicalJson(value ?? null);
};

/** The reason an item's tick carries from `from` to `to`, or null when it must be checked again. */
export function carryReason(
  item: ChecklistItem,
  from: { number: number; document: unknown },
  to: { number: number; document: unknown },
): string | null {
  if (!item.covers) return null;
  if (item.covers.some((key) => part(from.document, key) !== part(to.document, key))) return null;
  return `Carried from the review of revision ${from.number}: revision ${to.number} leaves ${coveredWords(item.covers)} unchanged.`;
}

/** Every checklist item whose tick would carry, with its reason. */
export function carriedItems(
  ticked: ReadonlySet<string>,
  from: { number: number; document: unknown },
  to: { number: number; document: unknown },
): { item: string; reason: string }[] {
  return PRE_MAIDEN_CHECKLIST.flatMap((item) => {
    if (!ticked.has(item.id)) return [];
    const reason = carryReason(item, from, to);
    return reason ? [{ item: item.id, reason }] : [];
  });
}
