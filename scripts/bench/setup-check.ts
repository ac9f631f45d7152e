import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { makeStressSetup } from '../../fixtures/stress';
import { analyzeSetup } from '@shared/analyze';
import type { Benchmark } from './benchmark';

// Parse + check (analyzeSetup) of the demo setup and of the generated stress setup.
export const DEMO_FILE = fileURLToPath(
  new URL('../../fixtures/valid/scale-16-channel-two-receivers.yaml', import.meta.url),
);

const demo = readFileSync(DEMO_FILE, 'utf8');
const stress = makeStressSetup();

export const benchmarks: Benchmark[] = [
  { name: 'parse + check, demo (16 ch, 2 receivers)', budgetMs: 2, run: () => analyzeSetup(demo) },
  {
    name: 'parse + check, stress (32 ch, 4 rx, 300 mixes)',
    budgetMs: 20,
    run: () => analyzeSetup(stress),
    iterations: 100,
  },
];
