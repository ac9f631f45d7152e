import { mixCurve, type CurvePoint } from '@shared/evaluate/mix-curve';
import type { Setup } from '@shared/format/schema';

/** One mix whose response differs between two revisions, at one position of its rates switch. */
export interface ChangedCurve {
  mixId: string;
  to: number;
  /** The rates switch and its position, when the mix has rates on either side. */
  rates: { control: string; position: number } | null;
  before: CurvePoint[];
  after: CurvePoint[];
}

/** Samples every 5 %: enough for the plot's line; the text table reads every 20 %. */
const SAMPLES = 41;

const sameCurve = (a: readonly CurvePoint[], b: readonly CurvePoint[]) =>
  a.length === b.length && a.every((point, i) => Math.abs(point.y - b[i].y) < 1e-9);

/**
 * The mixes present in both revisions whose curve (weight, expo, offset or a rates
 * weight) changed, one entry per rates position where it did: a low rate changed at
 * position 1 shows there, not at position 0 where nothing moved. Mixes are matched by
 * id, as the semantic diff matches them.
 */
export function changedCurves(before: Setup, after: Setup): ChangedCurve[] {
  const result: ChangedCurve[] = [];
  for (const mix of after.mixes) {
    const old = before.mixes.find((candidate) => candidate.id === mix.id);
    if (!old) continue;
    const control = mix.rates?.control ?? old.rates?.control;
    const positions = control ? Math.max(mix.rates?.weights.length ?? 1, old.rates?.weights.length ?? 1, 1) : 1;
    for (let position = 0; position < positions; position += 1) {
      const set = control ? { [control]: position } : {};
      const left = mixCurve(before, mix.id, SAMPLES, set);
      const right = mixCurve(after, mix.id, SAMPLES, set);
      if (sameCurve(left, right)) continue;
      result.push({
        mixId: mix.id,
        to: mix.to,
        rates: control ? { control, position } : null,
        before: left,
        after: right,
      });
    }
  }
  return result;
}
