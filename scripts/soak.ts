// npm run soak: the API under a mixed load for 60 seconds with PostgreSQL killed for
// about 5 seconds in the middle. A throwaway cluster (durable: fsync on) and the API as
// `npm start` runs it, a cluster of WEB_CONCURRENCY processes (default one per CPU; the
// bench server's primary forks them) on loopback; concurrent clients read the hangar, histories and
// compares and save revisions, several clients on each model so saves collide (409)
// as they do between two tabs. Midway the database is stopped the hard way
// (pg_ctl -m immediate, like a crash) and started again. Afterwards the database is
// checked against what the clients were told: every save answered 201 is there with
// its content hash, numbers are gapless, each revision's parent is the one before it,
// and no revision row is partial. Some clients invite members, so the mail queue runs
// through the outage too; the report counts its rows (delivered, retried, pending,
// failed) and every invitation answered 201 must have its mail queued. Prints the
// figures; exits 1 when a check fails.
// SOAK_SECONDS, SOAK_CLIENTS and SOAK_OUTAGE_SECONDS change the run's shape.
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { chmodSync, createWriteStream, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { QueryTypes, type Sequelize } from 'sequelize';
import { contentHash } from '@shared/canonical/content-hash';
import { signSession } from '@api/auth/tokens';
import { createModel } from '@api/commands/create-model';
import { saveRevision } from '@api/commands/save-revision';
import { defaultConfig } from '@api/config';
import { isRoot, startCluster, type Cluster } from '@api/db/cluster';
import { migrate } from '@api/db/migrate';
import { createSequelize } from '@api/db/sequelize';
import { initModels, Membership, User, Workspace, type SetupModel } from '@api/models';
import { workerCount } from '@api/worker-count';
import { DEMO_SETUP, demoVariant } from './bench/support/bench-fixtures';

const seconds = (name: string, fallback: number) => {
  const value = Number(process.env[name] ?? fallback);
  if (!Number.isFinite(value) || value <= 0) throw new Error(`${name} must be a positive number`);
  return value;
};
const DURATION_MS = seconds('SOAK_SECONDS', 60) * 1000;
const CLIENTS = Math.round(seconds('SOAK_CLIENTS', 12));
const OUTAGE_MS = seconds('SOAK_OUTAGE_SECONDS', 5) * 1000;
const OUTAGE_AT_MS = DURATION_MS / 2 - OUTAGE_MS / 2;
const MODELS = 8;
const HISTORY_PER_MODEL = 40;
const REQUEST_TIMEOUT_MS = 15_000;
const WORKERS = workerCount(process.env);

type Kind = 'hangar' | 'history' | 'compare' | 'save' | 'invite';
const MIX: [Kind, number][] = [
  ['hangar', 25],
  ['history', 25],
  ['compare', 20],
  ['save', 25],
  ['invite', 5],
];

interface Sample {
  kind: Kind;
  status: number | 'timeout' | 'network';
  /** The error code of a refusal, e.g. stale-base or database-unavailable. */
  code?: string;
  ms: number;
  /** performance.now() when the request was sent. */
  at: number;
}

/** When PostgreSQL was killed and when it was running again (performance.now()). */
interface Outage {
  from: number;
  to: number;
}

interface SavedAnswer {
  id: string;
  modelId: string;
  number: number;
  contentHash: string;
}

const bench = fileURLToPath(new URL('./bench/support/bench-server.ts', import.meta.url));

/** The multi-process API (the bench server's cluster), its stderr kept in a file to count what it logged. */
async function startApi(
  databaseUrl: string,
  logFile: string,
): Promise<{ url: string; child: ChildProcess; jwtSecret: string }> {
  const jwtSecret = randomBytes(32).toString('hex');
  const child = spawn(process.execPath, ['--import', 'tsx', bench], {
    env: { ...process.env, BENCH_DATABASE_URL: databaseUrl, BENCH_JWT_SECRET: jwtSecret, BENCH_MAIL: '1' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stderr.pipe(createWriteStream(logFile));
  const url = await new Promise<string>((resolve, reject) => {
    let output = '';
    child.once('exit', (code) => reject(new Error(`the API exited before it listened (code ${code}); see ${logFile}`)));
    child.stdout.on('data', (chunk: Buffer) => {
      output += chunk.toString('utf8');
      if (output.includes('\n')) resolve(output.split('\n')[0].trim());
    });
  });
  child.removeAllListeners('exit');
  return { url, child, jwtSecret };
}

/** pg_ctl as the server's own user: `immediate` is a crash (no shutdown checkpoint, recovery on start). */
function pgCtl(cluster: Cluster, args: string[]): Promise<void> {
  const pgctl = path.join(cluster.binDir, 'pg_ctl');
  const [command, argv] = isRoot() ? ['runuser', ['-u', 'postgres', '--', pgctl, ...args]] : [pgctl, args];
  return new Promise((resolve, reject) => {
    const child = spawn(command, argv, { cwd: '/', stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    child.stdout.on('data', (chunk) => (output += chunk));
    child.stderr.on('data', (chunk) => (output += chunk));
    child.on('error', reject);
    child.on('exit', (code) =>
      code === 0 ? resolve() : reject(new Error(`pg_ctl ${args.join(' ')} failed: ${output.trim()}`)),
    );
  });
}

async function seed(sequelize: Sequelize): Promise<{ user: User; workspace: Workspace; models: SetupModel[] }> {
  const user = await User.create({
    email: `soak-${randomBytes(4).toString('hex')}@soak.example`,
    name: 'Soak Pilot',
    passwordHash: 'not-a-password-hash',
  });
  const workspace = await Workspace.create({ name: 'Soak field' });
  // The owner, so the soak can invite members and queue mail.
  await Membership.create({ workspaceId: workspace.id, userId: user.id, role: 'owner' });
  const models: SetupModel[] = [];
  for (let index = 0; index < MODELS; index++) {
    const { model } = await createModel(sequelize, {
      workspace,
      author: user,
      name: `Soak model ${index + 1}`,
      yaml: DEMO_SETUP,
    });
    for (let number = 1; number < HISTORY_PER_MODEL; number++) {
      await saveRevision(sequelize, {
        modelId: model.id,
        author: user,
        base: number,
        yaml: demoVariant(index * 1000 + number),
        message: `Seeded ${number + 1}`,
      });
    }
    models.push(model);
  }
  return { user, workspace, models };
}

const percentile = (sorted: number[], p: number): number =>
  sorted.length === 0 ? 0 : sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
const pick = <T>(items: readonly T[]): T => items[Math.floor(Math.random() * items.length)];

function pickKind(): Kind {
  let roll = Math.random() * 100;
  for (const [kind, weight] of MIX) {
    roll -= weight;
    if (roll < 0) return kind;
  }
  return 'save';
}

async function runLoad(api: string, headers: Record<string, string>, workspaceId: string, models: SetupModel[]) {
  const samples: Sample[] = [];
  const saved: SavedAnswer[] = [];
  const revisionIds = new Map<string, string[]>();
  for (const model of models) {
    const page = (await (await fetch(`${api}/api/models/${model.id}/revisions?limit=100`, { headers })).json()) as {
      data: { id: string }[];
    };
    revisionIds.set(
      model.id,
      page.data.map((revision) => revision.id),
    );
  }
  const start = performance.now();
  const deadline = start + DURATION_MS;
  let variant = 1_000_000;
  let conflicts = 0;
  let invited = 0;

  async function timed(
    kind: Kind,
    url: string,
    init: RequestInit = {},
  ): Promise<{ status: number; text: string } | null> {
    const begun = performance.now();
    try {
      const response = await fetch(url, {
        ...init,
        headers: { ...headers, ...(init.headers as Record<string, string>) },
        signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS),
      });
      const text = await response.text();
      const code =
        response.status >= 400
          ? ((JSON.parse(text) as { error?: { code?: string } }).error?.code ?? 'no-code')
          : undefined;
      samples.push({ kind, status: response.status, code, ms: performance.now() - begun, at: begun });
      return { status: response.status, text };
    } catch (error) {
      const status = error instanceof DOMException && error.name === 'TimeoutError' ? 'timeout' : 'network';
      samples.push({ kind, status, ms: performance.now() - begun, at: begun });
      return null;
    }
  }

  async function client(): Promise<void> {
    // Each client keeps its own idea of each model's latest number, so clients on one
    // model race and the losers see 409 with the latest number, like a second tab.
    const bases = new Map(models.map((model) => [model.id, HISTORY_PER_MODEL]));
    while (performance.now() < deadline) {
      const model = pick(models);
      const kind = pickKind();
      if (kind === 'hangar') await timed(kind, `${api}/api/workspaces/${workspaceId}/models`);
      else if (kind === 'history') await timed(kind, `${api}/api/models/${model.id}/revisions?limit=50`);
      else if (kind === 'compare') {
        const ids = revisionIds.get(model.id)!;
        await timed(kind, `${api}/api/compare?from=${pick(ids)}&to=${pick(ids)}`);
      } else if (kind === 'invite') {
        const email = `soak-invitee-${randomBytes(5).toString('hex')}@soak.example`;
        const response = await timed(kind, `${api}/api/workspaces/${workspaceId}/invitations`, {
          method: 'POST',
          headers: { 'Content-Type': 'application/json' },
          body: JSON.stringify({ email, role: 'viewer' }),
        });
        if (response?.status === 201) invited++;
      } else {
        const yaml = demoVariant(variant++);
        const response = await timed(kind, `${api}/api/models/${model.id}/revisions`, {
          method: 'POST',
          headers: { 'Content-Type': 'application/json' },
          body: JSON.stringify({ base: bases.get(model.id), message: 'Soak save', yaml }),
        });
        if (response?.status === 201) {
          const { data } = JSON.parse(response.text) as { data: { id: string; number: number; content_hash: string } };
          saved.push({ id: data.id, modelId: model.id, number: data.number, contentHash: data.content_hash });
          bases.set(model.id, data.number);
          revisionIds.get(model.id)!.push(data.id);
        } else if (response?.status === 409) {
          conflicts++;
          const { error } = JSON.parse(response.text) as { error: { details: { latest: number } } };
          bases.set(model.id, error.details.latest);
        }
      }
    }
  }

  await Promise.all(Array.from({ length: CLIENTS }, () => client()));
  return { samples, saved, conflicts, invited, start, elapsedMs: performance.now() - start };
}

async function verify(sequelize: Sequelize, saved: SavedAnswer[], modelIds: string[]) {
  const rows = await sequelize.query<{
    id: string;
    model_id: string;
    number: number;
    parent_id: string | null;
    content_hash: string;
    document: unknown;
    yaml_text: string;
    findings: unknown;
  }>(
    'SELECT id, model_id, number, parent_id, content_hash, document, yaml_text, findings FROM revisions WHERE model_id = ANY($ids::uuid[]) ORDER BY model_id, number',
    { bind: { ids: modelIds }, type: QueryTypes.SELECT },
  );
  const byId = new Map(rows.map((row) => [row.id, row]));
  const missing = saved.filter((answer) => {
    const row = byId.get(answer.id);
    return (
      !row || row.number !== answer.number || row.model_id !== answer.modelId || row.content_hash !== answer.contentHash
    );
  });
  let gaps = 0;
  let brokenParents = 0;
  let previous: (typeof rows)[number] | null = null;
  for (const row of rows) {
    const first = !previous || previous.model_id !== row.model_id;
    if (first ? row.number !== 1 : row.number !== previous!.number + 1) gaps++;
    if (first ? row.parent_id !== null : row.parent_id !== previous!.id) brokenParents++;
    previous = row;
  }
  const partial = rows.filter(
    (row) =>
      !row.yaml_text ||
      row.document === null ||
      !Array.isArray(row.findings) ||
      contentHash(row.document) !== row.content_hash,
  ).length;
  const answeredIds = new Set(saved.map((answer) => answer.id));
  const soakRows = rows.filter((row) => row.number > HISTORY_PER_MODEL);
  const unanswered = soakRows.filter((row) => !answeredIds.has(row.id)).length;
  const [{ unaudited }] = await sequelize.query<{ unaudited: number }>(
    `SELECT count(*)::int AS unaudited FROM revisions r WHERE r.model_id = ANY($ids::uuid[]) AND r.number > $seeded
       AND NOT EXISTS (SELECT 1 FROM audit_events a WHERE a.subject_type = 'revision' AND a.subject_id = r.id)`,
    { bind: { ids: modelIds, seeded: HISTORY_PER_MODEL }, type: QueryTypes.SELECT },
  );
  return {
    rows: rows.length,
    soakRows: soakRows.length,
    missing: missing.length,
    gaps,
    brokenParents,
    partial,
    unanswered,
    unaudited,
  };
}

interface MailQueue {
  rows: number;
  delivered: number;
  /** Rows that needed more than one attempt, delivered or not. */
  retried: number;
  pending: number;
  failed: number;
}

/** The outbox table once the delivery loop has had up to 30 s to send what is due. */
async function mailQueue(sequelize: Sequelize): Promise<MailQueue> {
  const count = async (): Promise<MailQueue> => {
    const [row] = await sequelize.query<Record<keyof MailQueue, string>>(
      `SELECT count(*) AS rows,
              count(*) FILTER (WHERE state = 'delivered') AS delivered,
              count(*) FILTER (WHERE attempts > 1) AS retried,
              count(*) FILTER (WHERE state = 'pending') AS pending,
              count(*) FILTER (WHERE state = 'failed') AS failed
         FROM outbox`,
      { type: QueryTypes.SELECT },
    );
    return {
      rows: Number(row.rows),
      delivered: Number(row.delivered),
      retried: Number(row.retried),
      pending: Number(row.pending),
      failed: Number(row.failed),
    };
  };
  for (let waited = 0; waited < 30_000; waited += 500) {
    const queue = await count();
    if (queue.pending === 0) return queue;
    await new Promise((resolve) => setTimeout(resolve, 500));
  }
  return count();
}

function report(
  load: Awaited<ReturnType<typeof runLoad>>,
  outage: Outage,
  checks: Awaited<ReturnType<typeof verify>>,
  mail: MailQueue,
  extra: { recoveryMs: number | null; apiAlive: boolean; loggedUnexpected: number; workersDied: number },
) {
  const { samples, elapsedMs } = load;
  // Requests sent while the server was away, and in the second after it was back.
  const during = (sample: Sample) => sample.at + sample.ms >= outage.from && sample.at <= outage.to + 1_000;
  const line = (label: string, value: string | number) => console.log(`  ${label.padEnd(34)} ${value}`);
  const latency = (subset: Sample[]) => {
    const sorted = subset.map((sample) => sample.ms).sort((a, b) => a - b);
    return `p50 ${percentile(sorted, 50).toFixed(1)} ms   p95 ${percentile(sorted, 95).toFixed(1)} ms   p99 ${percentile(sorted, 99).toFixed(1)} ms`;
  };
  const statuses = (subset: Sample[]) => {
    const counts = new Map<string, number>();
    for (const sample of subset) {
      const key = sample.code ? `${sample.status} ${sample.code}` : String(sample.status);
      counts.set(key, (counts.get(key) ?? 0) + 1);
    }
    return [...counts.entries()]
      .sort()
      .map(([status, count]) => `${status}: ${count}`)
      .join(', ');
  };

  console.log(
    `\nLoad: ${CLIENTS} clients for ${(elapsedMs / 1000).toFixed(1)} s; PostgreSQL killed at ${((outage.from - load.start) / 1000).toFixed(1)} s, running again at ${((outage.to - load.start) / 1000).toFixed(1)} s`,
  );
  line('requests', samples.length);
  line('requests per second', (samples.length / (elapsedMs / 1000)).toFixed(0));
  line('latency, all', latency(samples));
  line('latency, outside the outage', latency(samples.filter((sample) => !during(sample))));
  for (const [kind] of MIX)
    line(`latency, ${kind}`, latency(samples.filter((sample) => sample.kind === kind && !during(sample))));
  line('answers by status', statuses(samples));
  line('  during the outage (+1 s)', statuses(samples.filter(during)) || 'none');
  line('  outside the outage', statuses(samples.filter((sample) => !during(sample))));
  const errors = samples.filter((sample) => typeof sample.status !== 'number' || sample.status >= 500);
  line('errors (5xx, timeouts, network)', errors.length);
  line('500 answers', samples.filter((sample) => sample.status === 500).length);
  line('saves answered 201', load.saved.length);
  line('saves answered 409 (stale base)', load.conflicts);
  line(
    'first 200 from /api/health after restart',
    extra.recoveryMs === null ? 'never' : `${extra.recoveryMs.toFixed(0)} ms`,
  );
  line('API processes', `${WORKERS} workers sharing one port`);
  line('API primary alive at the end', extra.apiAlive ? 'yes' : 'NO');
  line('API workers that died (replaced)', extra.workersDied);
  line('unexpected errors the API logged', extra.loggedUnexpected);

  console.log('\nDatabase afterwards:');
  line('revision rows of the soak models', `${checks.rows} (${checks.soakRows} saved during the soak)`);
  line('201 saves missing or different', checks.missing);
  line('gaps in revision numbers', checks.gaps);
  line('parents not the revision before', checks.brokenParents);
  line('partial revision rows', checks.partial);
  line('revisions without their audit entry', checks.unaudited);
  line('rows no client heard 201 for', `${checks.unanswered} (committed, then the answer was lost)`);

  console.log('\nMail queue afterwards (outbox table):');
  line('invitations answered 201', load.invited);
  line('mail rows', mail.rows);
  line('delivered', mail.delivered);
  line('retried (more than one attempt)', mail.retried);
  line('pending after 30 s', mail.pending);
  line('failed', mail.failed);
}

async function main(): Promise<number> {
  const folder = mkdtempSync(path.join(os.tmpdir(), 'bindery-soak-'));
  chmodSync(folder, 0o755);
  let cluster: Cluster | null = null;
  let sequelize: Sequelize | null = null;
  let api: Awaited<ReturnType<typeof startApi>> | null = null;
  try {
    console.log('Starting a throwaway PostgreSQL cluster and the API...');
    cluster = await startCluster({ dataDir: path.join(folder, 'pg'), database: 'bindery_soak' });
    sequelize = createSequelize(cluster.url);
    await migrate(sequelize);
    initModels(sequelize);
    const { user, workspace, models } = await seed(sequelize);
    const logFile = path.join(folder, 'api-stderr.log');
    api = await startApi(cluster.url, logFile);
    const headers = { Authorization: `Bearer ${signSession(user, defaultConfig({ jwtSecret: api.jwtSecret }))}` };
    console.log(
      `API at ${api.url}; ${MODELS} models with ${HISTORY_PER_MODEL} revisions each; ${CLIENTS} clients for ${DURATION_MS / 1000} s.`,
    );

    const outage: Outage = { from: 0, to: 0 };
    const running = cluster;
    const loadPromise = runLoad(api.url, headers, workspace.id, models);
    await new Promise((resolve) => setTimeout(resolve, OUTAGE_AT_MS));
    outage.from = performance.now();
    await pgCtl(running, ['-D', running.dataDir, '-m', 'immediate', 'stop']);
    console.log('  PostgreSQL killed (pg_ctl -m immediate)');
    // Starting again (crash recovery, pg_ctl waiting for connections) takes about a second of the outage.
    await new Promise((resolve) =>
      setTimeout(resolve, Math.max(0, OUTAGE_MS - 1_000 - (performance.now() - outage.from))),
    );
    await running.start();
    outage.to = performance.now();
    console.log(`  PostgreSQL running again after ${((outage.to - outage.from) / 1000).toFixed(1)} s`);
    let recoveryMs: number | null = null;
    for (let attempt = 0; attempt < 200 && recoveryMs === null; attempt++) {
      const response = await fetch(`${api.url}/api/health`).catch(() => null);
      if (response?.status === 200) recoveryMs = performance.now() - outage.to;
      else await new Promise((resolve) => setTimeout(resolve, 50));
    }
    const load = await loadPromise;
    const apiAlive = api.child.exitCode === null && api.child.signalCode === null;
    const checks = await verify(
      sequelize,
      load.saved,
      models.map((model) => model.id),
    );
    const logged = readFileSync(logFile, 'utf8');
    const loggedUnexpected = (logged.match(/\[internal-error\]/g) ?? []).length;
    const workersDied = (logged.match(/\[worker-died\]/g) ?? []).length;
    const mail = await mailQueue(sequelize);
    report(load, outage, checks, mail, { recoveryMs, apiAlive, loggedUnexpected, workersDied });

    const failures = [
      load.samples.some((sample) => sample.status === 500) && 'some requests answered 500',
      !apiAlive && 'the API process died',
      workersDied > 0 && 'an API worker died',
      recoveryMs === null && 'the API did not recover',
      checks.missing > 0 && 'saves answered 201 are missing',
      checks.gaps > 0 && 'revision numbers have gaps',
      checks.brokenParents > 0 && 'parent links are broken',
      checks.partial > 0 && 'partial revision rows',
      checks.unaudited > 0 && 'revisions without their audit entry',
      load.saved.length === 0 && 'no save succeeded',
      mail.rows < load.invited && 'invitations answered 201 without their mail queued',
    ].filter(Boolean);
    console.log(failures.length === 0 ? '\nSoak passed.' : `\nSoak FAILED: ${failures.join('; ')}.`);
    return failures.length === 0 ? 0 : 1;
  } finally {
    if (api && api.child.exitCode === null) {
      const child = api.child;
      await new Promise<void>((resolve) => {
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      });
    }
    await sequelize?.close();
    await cluster?.remove();
    rmSync(folder, { recursive: true, force: true });
  }
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error(error instanceof Error ? error.stack : error);
    process.exit(1);
  },
);
