import { readFileSync } from 'node:fs';
import { makeStressSetup } from '../../fixtures/stress';
import { analyzeSetup } from '@shared/analyze';
import { evaluate } from '@shared/evaluate/evaluate';
import type { Benchmark } from './benchmark';
import { DEMO_FILE } from './setup-check';

// The bench evaluation (control positions -> channel values -> pin pulses) of the demo
// and stress setups, with a few controls moved off centre.
function setupOf(text: string) {
  const { setup } = analyzeSetup(text);
  if (!setup) throw new Error('benchmark setup is not schema-valid');
  return setup;
}

const demo = setupOf(readFileSync(DEMO_FILE, 'utf8'));
const stress = setupOf(makeStressSetup());

export const benchmarks: Benchmark[] = [
  {
    name: 'evaluate, demo',
    budgetMs: 2,
    run: () => evaluate(demo, { 'aileron-stick': 60, 'rate-switch': 1, 'motor-arm': 1, 'throttle-stick': 40 }),
    iterations: 1000,
  },
  {
    name: 'evaluate, stress',
    budgetMs: 20,
    run: () => evaluate(stress, { 'aileron-stick': 60, 'switch-a': 2, 'switch-b': 1, 'left-knob': -30 }),
    iterations: 1000,
  },
];
