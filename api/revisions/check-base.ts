import { Conflict } from '../errors';
import type { LockedModel } from './lock-model';

/**
 * A save names the revision it was edited from; under the model's lock, that must
 * still be the latest. Otherwise it is refused (409 stale-base) with the latest
 * number, and the editor shows what changed: the server never merges.
 */
export function requireLatestBase(latest: LockedModel['latest'], base: number): void {
  const latestNumber = latest?.number ?? 0;
  if (base !== latestNumber) {
    throw new Conflict(
      `Revision ${base} is not the latest: revision ${latestNumber} was saved meanwhile. Look at what changed and save again on revision ${latestNumber}.`,
      {
        code: 'stale-base',
        details: { base, latest: latestNumber, latest_id: latest?.id ?? null },
      },
    );
  }
}
