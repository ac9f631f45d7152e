import { QueryTypes, type Sequelize } from 'sequelize';
import { COMPARE_FORMAT_VERSION, compareContent } from '@shared/diff';

/**
 * The content part of a compare as JSON text, from the compare_cache table when any
 * process has computed it before, computed and stored otherwise. Two processes missing
 * at once both compute the same answer; the second insert is a no-op.
 */
export async function contentComparisonJson(
  sequelize: Sequelize,
  hashes: { from: string; to: string },
  /** Loads the two documents only on a miss: a warm compare never reads them. */
  loadDocuments: () => Promise<[unknown, unknown]>,
): Promise<string> {
  const key = { fromHash: hashes.from, toHash: hashes.to, version: COMPARE_FORMAT_VERSION };
  const [hit] = await sequelize.query<{ result: string }>(
    'SELECT result FROM compare_cache WHERE from_hash = $fromHash AND to_hash = $toHash AND format_version = $version',
    { bind: key, type: QueryTypes.SELECT },
  );
  if (hit) return hit.result;
  const [before, after] = await loadDocuments();
  const result = JSON.stringify(compareContent({ data: before }, { data: after }));
  await sequelize.query(
    `INSERT INTO compare_cache (from_hash, to_hash, format_version, result) VALUES ($fromHash, $toHash, $version, $result)
     ON CONFLICT DO NOTHING`,
    { bind: { ...key, result }, type: QueryTypes.INSERT },
  );
  return result;
}
