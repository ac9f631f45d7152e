/**
 * A file name for a revision download built only from safe characters: the model's
 * name as a lower-case slug (accents folded, everything else a dash) and the
 * revision number, e.g. `tern-1800-r12.yaml`.
 */
// Letters that do not decompose into a base letter and an accent.
const FOLDED: Record<string, string> = { ø: 'o', æ: 'ae', œ: 'oe', ß: 'ss', đ: 'd', ð: 'd', ł: 'l', þ: 'th', ı: 'i' };

export function revisionFileName(modelName: string, number: number, suffix = '.yaml'): string {
  const slug = modelName
    .toLowerCase()
    .replace(/[øæœßđðłþı]/g, (letter) => FOLDED[letter])
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/, '');
  return `${slug || 'model'}-r${number}${suffix}`;
}
