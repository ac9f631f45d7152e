import type { Sequelize } from 'sequelize';
import { inPreparedTransaction } from '../db/prepared';
import { recordChanges } from './record-changes';

// The recordings still running, per database handle, so a server (or a test) can wait
// for them before it closes the connections they use.
const pending = new WeakMap<Sequelize, Set<Promise<void>>>();

/**
 * Records the model's changed settings (revision_changes) after a save has answered, in
 * a transaction of its own. A save does not wait for provenance: its revision is durable
 * and acknowledged already, and recordChanges works from the model's recorded progress,
 * so a recording that fails here (or never runs, the process having died) leaves the
 * revision unrecorded and the next provenance read fills it in (provenanceOf, historyOf).
 */
export function recordChangesLater(sequelize: Sequelize, modelId: string, options: { logErrors: boolean }): void {
  let running = pending.get(sequelize);
  if (!running) pending.set(sequelize, (running = new Set()));
  const recording: Promise<void> = inPreparedTransaction(sequelize, (run) => recordChanges(run, modelId))
    .catch((error: unknown) => {
      if (options.logErrors) console.error('[provenance-deferred]', error);
    })
    .finally(() => running.delete(recording));
  running.add(recording);
}

/** Resolves once every recording started on this database handle has ended. */
export async function settleRecordings(sequelize: Sequelize): Promise<void> {
  const running = pending.get(sequelize);
  while (running && running.size > 0) await Promise.allSettled([...running]);
}
