import type { MergeConflict } from '../lineage/merge-setups';
import type { Change } from '../diff/types';

/** Where one leaf setting of a revision came from: `GET /api/models/:id/provenance`. */
export interface ProvenanceEntry {
  /** Identity path, e.g. `receivers[id=wing].map[pin=4].failsafe`. */
  path: string;
  /** The revision that last changed the value; the source model's when inherited. */
  revision: { id: string; number: number; model_id: string };
  author: { id: string; name: string } | null;
  created_at: string;
  message: string;
  /** True when the value came with the fork (or a merge) from the source model. */
  inherited: boolean;
}

/** One revision that changed a setting: `GET /api/models/:id/provenance/history?path=`, newest first. */
export interface ProvenanceChange {
  /** The model's own revision that changed it; `parent_id` is what it is compared with. */
  revision: { id: string; number: number; parent_id: string | null };
  /** The model whose author, date and message these are: the source's when inherited. */
  origin_model_id: string;
  author: { id: string; name: string } | null;
  created_at: string;
  message: string;
  inherited: boolean;
  /** The leaf paths at or under the asked path that this revision changed. */
  paths: string[];
}

/** What a fork's source changed since the fork last took it in: `GET /api/models/:id/source-updates`. */
export interface SourceUpdates {
  source: { model_id: string; revision_id: string; number: number; name: string };
  /** The source revision the fork was made from or last took in. */
  base: { revision_id: string; number: number };
  /** The fork's latest revision, which a merge saves on (its number is the POST's `base`). */
  ours: { revision_id: string; number: number };
  /** Source revisions newer than `base`. */
  behind: number;
  /** What the source changed since `base`. */
  changes: Change[];
  conflicts: MergeConflict[];
}
