import type { Sequelize } from 'sequelize';
import { COMPARE_FORMAT_VERSION, compareContent } from '@shared/diff';
import { preparedStatement, runPrepared } from '../db/prepared';

// The compare_cache table holds the content part of a compare as JSON text, keyed by
// the two content hashes and COMPARE_FORMAT_VERSION, so every API process reuses what
// any of them computed. It is read as part of the statement that reads a compare's
// sides (api/queries/compare-sides.ts), so a warm compare costs no round trip of its
// own; this module computes and stores on a miss.

const insert = preparedStatement(
  'compare-cache-insert',
  `INSERT INTO compare_cache (from_hash, to_hash, format_version, result) VALUES ($1, $2, $3, $4)
   ON CONFLICT DO NOTHING`,
);

/**
 * Computes the content part of a compare of two documents and stores it. Two processes
 * missing at once both compute the same answer; the second insert is a no-op.
 */
export async function computeAndCacheComparison(
  sequelize: Sequelize,
  hashes: { from: string; to: string },
  [before, after]: readonly [unknown, unknown],
): Promise<string> {
  const result = JSON.stringify(compareContent({ data: before }, { data: after }));
  await runPrepared(sequelize, insert, [hashes.from, hashes.to, COMPARE_FORMAT_VERSION, result]);
  return result;
}
