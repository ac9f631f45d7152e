import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../db/migrate';
import * as accountsAndWorkspaces from './0001-accounts-and-workspaces';
import * as modelsAndRevisions from './0002-models-and-revisions';
import * as mailAndTeam from './0003-mail-and-team';
import * as receivers from './0004-receivers';
import * as reviews from './0005-reviews';
import * as mailQueue from './0006-mail-queue';
import * as revokedSessions from './0007-revoked-sessions';
import * as rateLimits from './0008-rate-limits';
import * as importJobs from './0010-import-jobs';
import * as compareCache from './0012-compare-cache';
import * as passwordResetRequests from './0013-password-reset-requests';
import * as saveRevisionFunction from './0030-save-revision-function';
import * as compareCacheUnlogged from './0031-compare-cache-unlogged';
import * as hangarAndShelfOrder from './0032-hangar-and-shelf-order';
import * as reviewThreadsAndCarriedTicks from './0040-review-threads-and-carried-ticks';
import * as modelArchive from './0050-model-archive';
import * as saveFollowsModelName from './0059-save-follows-model-name';
import * as receiverShortCodes from './0060-receiver-short-codes';
import * as provenanceMergesClubRules from './0070-provenance-merges-club-rules';
import * as saveAnswersClubRules from './0090-save-answers-club-rules';

export interface MigrationModule {
  up: MigrationFn<MigrationContext>;
  down: MigrationFn<MigrationContext>;
}

// Applied in this order and recorded in schema_migrations; a new migration is a new
// file `NNNN-name.ts` plus one line here. Applied migrations are never edited.
export const migrations: { name: string; module: MigrationModule }[] = [
  { name: '0001-accounts-and-workspaces', module: accountsAndWorkspaces },
  { name: '0002-models-and-revisions', module: modelsAndRevisions },
  { name: '0003-mail-and-team', module: mailAndTeam },
  { name: '0004-receivers', module: receivers },
  { name: '0005-reviews', module: reviews },
  { name: '0006-mail-queue', module: mailQueue },
  { name: '0007-revoked-sessions', module: revokedSessions },
  { name: '0008-rate-limits', module: rateLimits },
  { name: '0010-import-jobs', module: importJobs },
  { name: '0012-compare-cache', module: compareCache },
  { name: '0013-password-reset-requests', module: passwordResetRequests },
  { name: '0030-save-revision-function', module: saveRevisionFunction },
  { name: '0031-compare-cache-unlogged', module: compareCacheUnlogged },
  { name: '0032-hangar-and-shelf-order', module: hangarAndShelfOrder },
  { name: '0040-review-threads-and-carried-ticks', module: reviewThreadsAndCarriedTicks },
  { name: '0050-model-archive', module: modelArchive },
  { name: '0059-save-follows-model-name', module: saveFollowsModelName },
  { name: '0060-receiver-short-codes', module: receiverShortCodes },
  { name: '0070-provenance-merges-club-rules', module: provenanceMergesClubRules },
  { name: '0090-save-answers-club-rules', module: saveAnswersClubRules },
];
