import type { Setup } from '../format/schema';
import { controlsById, type Positions } from './control-value';
import { mixWeight } from './evaluate';
import { expoCurve } from './expo-curve';

export interface CurvePoint {
  x: number;
  y: number;
}

/**
 * A mix's response for plotting: `samples` points with x from -100 to +100 percent of
 * its input and y = w * curve(x) + offset in percent, where w is the rates weight at
 * the rates switch's position in `positions` (position 0 when unset). Whether the mix
 * is active is not applied: the curve shows what it does when it counts. Unknown mix
 * ids give no points.
 */
export function mixCurve(setup: Setup, mixId: string, samples = 41, positions: Positions = {}): CurvePoint[] {
  const mix = setup.mixes.find((candidate) => candidate.id === mixId);
  if (!mix) return [];
  const count = Math.max(2, Math.floor(samples));
  const weight = mixWeight(mix, controlsById(setup.controls), positions);
  const points: CurvePoint[] = [];
  for (let i = 0; i < count; i += 1) {
    const x = -100 + (200 * i) / (count - 1);
    const y = weight * expoCurve(x / 100, mix.expo) + mix.offset;
    points.push({ x, y: y === 0 ? 0 : y });
  }
  return points;
}
