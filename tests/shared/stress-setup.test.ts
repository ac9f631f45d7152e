import { describe, expect, it } from 'vitest';
import { makeStressSetup } from '../../fixtures/stress';
import { analyzeSetup } from '@shared/analyze';
import { evaluate } from '@shared/evaluate/evaluate';

describe('the generated stress setup', () => {
  const text = makeStressSetup();
  const analysis = analyzeSetup(text);

  it('has the size the benchmarks promise', () => {
    const setup = analysis.setup!;
    expect(setup.channels).toHaveLength(32);
    expect(setup.receivers.map((r) => [r.outputs, r.map.length])).toEqual([
      [8, 8],
      [8, 8],
      [8, 8],
      [8, 8],
    ]);
    expect(setup.mixes).toHaveLength(300);
    expect(setup.controls.filter((c) => c.kind === 'switch')).toHaveLength(8);
  });

  it('is valid: no errors, no warnings, no infos', () => {
    expect(analysis.findings).toEqual([]);
  });

  it('is the same text every time', () => {
    expect(makeStressSetup()).toBe(text);
  });

  it('evaluates every pin', () => {
    const outputs = evaluate(analysis.setup!, { 'switch-b': 1, 'aileron-stick': 100 });
    expect(outputs.receivers.flatMap((r) => r.pins)).toHaveLength(32);
  });
});
