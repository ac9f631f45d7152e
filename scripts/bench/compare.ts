import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseDocument } from 'yaml';
import { makeStressSetup } from '../../fixtures/stress';
import { analyzeSetup } from '@shared/analyze';
import { compareRevisions, type CompareSide } from '@shared/diff';
import type { Benchmark } from './benchmark';
import { DEMO_FILE } from './setup-check';

// Compare of two revisions as the server does it (stored text, document and findings
// in; changes, counts, findings delta, outputs delta and text diff out), for the demo
// setup and the stress setup. For reference, the same revisions are stored as commits
// in a plain git repository in a temp folder and `git diff` is timed on the same
// pairs; the ratio of the medians is printed after the table.

type Edit = (doc: ReturnType<typeof parseDocument>) => void;

// The second revision is the first with a typical save's edits. Both texts come from
// the same serialiser, so the text diff sees only the edited lines.
function revisions(text: string, edit: Edit): [string, string] {
  const before = parseDocument(text);
  const after = parseDocument(text);
  edit(after);
  return [before.toString({ lineWidth: 0 }), after.toString({ lineWidth: 0 })];
}

function side(text: string): CompareSide {
  const analysis = analyzeSetup(text);
  if (!analysis.setup) throw new Error('bench revision is not schema-valid');
  // The server has the document and findings stored, not the parsed Setup.
  return { text, data: analysis.data, findings: analysis.findings };
}

const demoPair = revisions(readFileSync(DEMO_FILE, 'utf8'), (doc) => {
  doc.setIn(['mixes', 0, 'weight'], 80);
  doc.setIn(['receivers', 1, 'map', 2, 'failsafe'], 1400);
  doc.setIn(['link', 'packet_rate_hz'], 150);
});
const stressPair = revisions(makeStressSetup(), (doc) => {
  for (const index of [5, 77, 150, 230]) doc.setIn(['mixes', index, 'expo'], 15);
  doc.setIn(['mixes', 40, 'id'], 'mix-41-renamed');
  doc.setIn(['receivers', 2, 'map', 3, 'failsafe'], 1400);
});
const demo = demoPair.map(side) as [CompareSide, CompareSide];
const stress = stressPair.map(side) as [CompareSide, CompareSide];

// Durations of the timed work, recorded by the runs themselves so that the ratio uses
// the runner's own runs (warm-up runs included, which the median barely feels).
const recorded = new Map<string, number[]>();
function timed(key: string, work: () => unknown): () => unknown {
  return () => {
    const start = performance.now();
    const result = work();
    const list = recorded.get(key) ?? [];
    list.push(performance.now() - start);
    recorded.set(key, list);
    return result;
  };
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

// A repository of its own: no user or system configuration, hooks or signing.
function gitRepository(): { git: (...args: string[]) => string; dir: string } | null {
  const dir = mkdtempSync(join(tmpdir(), 'bindery-bench-git-'));
  const env = { ...process.env, GIT_CONFIG_GLOBAL: '/dev/null', GIT_CONFIG_NOSYSTEM: '1' };
  const git = (...args: string[]) =>
    execFileSync(
      'git',
      [
        '-c',
        'user.name=Bench',
        '-c',
        'user.email=bench@example.invalid',
        '-c',
        'commit.gpgsign=false',
        '-c',
        'core.hooksPath=/dev/null',
        ...args,
      ],
      { cwd: dir, env, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] },
    );
  try {
    git('init', '-q');
  } catch {
    rmSync(dir, { recursive: true, force: true });
    return null;
  }
  process.once('exit', () => rmSync(dir, { recursive: true, force: true }));
  return { git, dir };
}

function commit(
  repo: NonNullable<ReturnType<typeof gitRepository>>,
  file: string,
  text: string,
  message: string,
): string {
  writeFileSync(join(repo.dir, file), text);
  repo.git('add', file);
  repo.git('commit', '-q', '--allow-empty', '-m', message);
  return repo.git('rev-parse', 'HEAD').trim();
}

const repo = gitRepository();

export const benchmarks: Benchmark[] = [
  {
    name: 'compare, demo revisions (diff, deltas, text)',
    budgetMs: 10,
    run: timed('compare demo', () => compareRevisions(demo[0], demo[1])),
  },
  {
    name: 'compare, stress revisions (32 ch, 300 mixes)',
    budgetMs: 50,
    iterations: 100,
    run: timed('compare stress', () => compareRevisions(stress[0], stress[1])),
  },
];

if (repo) {
  const [demoA, demoB] = demoPair.map((text, index) => commit(repo, 'demo.yaml', text, `demo revision ${index + 1}`));
  const [stressA, stressB] = stressPair.map((text, index) =>
    commit(repo, 'stress.yaml', text, `stress revision ${index + 1}`),
  );
  let saves = 0;
  benchmarks.push(
    {
      name: 'git (reference): store a revision as a commit',
      iterations: 30,
      run: () => {
        saves += 1;
        return commit(repo, 'demo.yaml', demoPair[saves % 2], `save ${saves}`);
      },
    },
    {
      name: 'git (reference): git diff, demo revisions',
      iterations: 50,
      run: timed('git demo', () => repo.git('diff', demoA, demoB, '--', 'demo.yaml')),
    },
    {
      name: 'git (reference): git diff, stress revisions',
      iterations: 50,
      run: timed('git stress', () => repo.git('diff', stressA, stressB, '--', 'stress.yaml')),
    },
  );
  process.once('beforeExit', () => {
    const lines: string[] = [];
    for (const pair of ['demo', 'stress']) {
      const ours = recorded.get(`compare ${pair}`);
      const theirs = recorded.get(`git ${pair}`);
      if (!ours || !theirs) continue;
      const ratio = median(ours) / median(theirs);
      lines.push(
        `compare / git diff, ${pair} revisions: ${ratio.toFixed(2)} (${median(ours).toFixed(3)} ms vs ${median(theirs).toFixed(3)} ms, git including its process start)`,
      );
    }
    // With --json the runner prints these ratios inside its JSON document.
    if (lines.length > 0 && !process.argv.includes('--json')) console.log(lines.join('\n'));
  });
} else {
  console.log('git is not available: the git reference timings are skipped.');
}
