import { roundPulse, unroundedPulse } from '../evaluate/evaluate';
import type { Travel } from '../format/schema';
import type { ChannelForm } from './channel-form';

// Where two channel forms give different pulses along one stick, the others held.
//
// Along one axis x in -1..1 a form is u(x) = c + a x + b x^3 (or a cut's constant); the
// pulse is P(clamp(u)), with P linear on each side of v = 0. Cutting -1..1 at the
// stationary points of both cubics and where either u crosses -100, 0 or +100 gives
// pieces on which both pulses are monotonic polynomials of degree at most 3. On such
// a piece the two are the same polynomial exactly when they agree at 4 distinct points
// (their difference has degree at most 3 and so at most 3 roots). Where they are not
// the same, the rounded pulses (rule 5) must still differ somewhere for a change to
// show: a rounded pulse changes only where the exact one crosses a half microsecond
// h. If one side crosses h at x* and the other is not at h there, the two round
// differently just on one side of x*; if every crossing of each side is a crossing of
// the other, the rounded pulses are constant between crossings and one point between
// each pair of neighbouring crossings decides. So the search below is complete: it
// finds a point wherever the rounded pulses differ on the line.

interface Line {
  /** u(x) = c + a x + b x^3, or a constant when cut. */
  c: number;
  a: number;
  b: number;
  travel: Travel;
}

/** The form along `axis` with the other axes at `held` (values in -1..1). */
export function lineOf(form: ChannelForm, axis: string, held: ReadonlyMap<string, number>): Line {
  if (form.cut) return { c: form.value, a: 0, b: 0, travel: form.travel };
  let c = form.constant;
  for (const [name, coefficient] of form.a) if (name !== axis) c += coefficient * (held.get(name) ?? 0);
  for (const [name, coefficient] of form.b) {
    if (name === axis) continue;
    const x = held.get(name) ?? 0;
    c += coefficient * x * x * x;
  }
  return { c, a: form.a.get(axis) ?? 0, b: form.b.get(axis) ?? 0, travel: form.travel };
}

function sum(line: Line, x: number): number {
  return line.c + line.a * x + line.b * x * x * x;
}

export function exactPulse(line: Line, x: number): number {
  return unroundedPulse(line.travel, Math.min(100, Math.max(-100, sum(line, x))));
}

export function roundedPulse(line: Line, x: number): number {
  return roundPulse(exactPulse(line, x));
}

/** Roots of f on [lo, hi] where f is monotonic there, by bisection; none without a sign change. */
function root(f: (x: number) => number, lo: number, hi: number): number | null {
  let flo = f(lo);
  const fhi = f(hi);
  if (flo === 0) return lo;
  if (fhi === 0) return hi;
  if (Math.sign(flo) === Math.sign(fhi)) return null;
  for (let i = 0; i < 80 && hi - lo > 1e-15; i += 1) {
    const mid = (lo + hi) / 2;
    const fm = f(mid);
    if (fm === 0) return mid;
    if (Math.sign(fm) === Math.sign(flo)) {
      lo = mid;
      flo = fm;
    } else hi = mid;
  }
  return (lo + hi) / 2;
}

function stationary(line: Line): number[] {
  if (line.b === 0) return [];
  const square = -line.a / (3 * line.b);
  if (!(square > 0 && square < 1)) return [];
  const r = Math.sqrt(square);
  return [-r, r];
}

function breakpoints(lines: readonly Line[]): number[] {
  const points = new Set<number>([-1, 1]);
  for (const line of lines) for (const x of stationary(line)) points.add(x);
  const monotone = [...points].sort((p, q) => p - q);
  for (const line of lines) {
    for (let i = 0; i + 1 < monotone.length; i += 1) {
      for (const level of [-100, 0, 100]) {
        const x = root((t) => sum(line, t) - level, monotone[i], monotone[i + 1]);
        if (x !== null) points.add(x);
      }
    }
  }
  return [...points].sort((p, q) => p - q);
}

/** Integer percents, roundest first, so that a reported point is one a pilot can set. */
const GRID: number[] = (() => {
  const steps = [100, 50, 25, 10, 5, 1];
  const seen = new Set<number>();
  const order: number[] = [];
  for (const step of steps) {
    const row: number[] = [];
    for (let p = -100; p <= 100; p += step) if (!seen.has(p)) row.push(p);
    // Centre first, then outward, the negative side before the positive.
    row.sort((p, q) => Math.abs(p) - Math.abs(q) || p - q);
    for (const p of row) {
      seen.add(p);
      order.push(p);
    }
  }
  return order;
})();

const differs = (left: Line, right: Line, x: number) => roundedPulse(left, x) !== roundedPulse(right, x);

/**
 * Candidate points (in -1..1) along the line where the rounded pulses of `left` and
 * `right` differ, roundest first; yields nothing when they are equal everywhere on it.
 */
export function* witnesses(left: Line, right: Line): Generator<number> {
  for (const p of GRID) if (differs(left, right, p / 100)) yield p / 100;
  const points = breakpoints([left, right]);
  for (let i = 0; i + 1 < points.length; i += 1) yield* onPiece(left, right, points[i], points[i + 1]);
}

function* onPiece(left: Line, right: Line, lo: number, hi: number): Generator<number> {
  if (hi - lo < 1e-15) return;
  // Four interior points decide whether the two exact pulses are one polynomial here.
  const probes = [0.2, 0.4, 0.6, 0.8].map((t) => lo + t * (hi - lo));
  if (probes.every((x) => Math.abs(exactPulse(left, x) - exactPulse(right, x)) <= 1e-9)) return;
  const crossings: number[] = [lo, hi];
  for (const [mine, other] of [
    [left, right],
    [right, left],
  ] as const) {
    const from = exactPulse(mine, lo);
    const to = exactPulse(mine, hi);
    const low = Math.min(from, to);
    const high = Math.max(from, to);
    for (let h = Math.ceil(low - 0.5) + 0.5; h < high; h += 1) {
      if (h <= low) continue;
      const x = root((t) => exactPulse(mine, t) - h, lo, hi);
      if (x === null) continue;
      crossings.push(x);
      if (Math.abs(exactPulse(other, x) - h) <= 1e-9) continue;
      for (let k = 1; k <= 45; k += 1) {
        const step = (hi - lo) * 2 ** -k;
        for (const candidate of [x - step, x + step])
          if (candidate >= lo && candidate <= hi && differs(left, right, candidate)) {
            yield candidate;
            break;
          }
      }
    }
  }
  crossings.sort((p, q) => p - q);
  for (let i = 0; i + 1 < crossings.length; i += 1) {
    const mid = (crossings[i] + crossings[i + 1]) / 2;
    if (differs(left, right, mid)) yield mid;
  }
}
