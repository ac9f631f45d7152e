import type { CurvePoint } from '@shared/evaluate/mix-curve';
import type { Mix } from '@shared/format/schema';
import { Card } from '../../../components/ui/card';
import { cx } from '../../../lib/cx';

export interface MixCurvePlotProps {
  mix: Mix;
  points: readonly CurvePoint[];
  /** The weight in use at the switches' positions (a rates weight, or `weight`). */
  weight: number;
  /** Where the mix's input sits now, and what it adds to its channel (percent). */
  now: { x: number; y: number };
  active: boolean;
  inputName: string;
}

const SIZE = 120;
const PAD = 8;

const fmt = (value: number) => `${value > 0 ? '+' : value < 0 ? '−' : ''}${Math.abs(Math.round(value))}`;

/**
 * One mix's response as a small plot: input −100..+100 % across, output up. The scale
 * grows past ±100 % when the weight and offset take the output further, so a curve
 * that saturates its channel shows that it does.
 */
export function MixCurvePlot({ mix, points, weight, now, active, inputName }: MixCurvePlotProps) {
  const reach = Math.max(100, ...points.map((point) => Math.abs(point.y)));
  const inner = SIZE - 2 * PAD;
  const sx = (x: number) => PAD + ((x + 100) / 200) * inner;
  const sy = (y: number) => PAD + ((reach - y) / (2 * reach)) * inner;
  const line = points.map((point) => `${sx(point.x).toFixed(1)},${sy(point.y).toFixed(1)}`).join(' ');
  const limitsShown = reach > 100;

  const label = `Curve of mix ${mix.id}: weight ${fmt(weight)} %, expo ${mix.expo} %, offset ${fmt(mix.offset)} %; input ${inputName} now at ${fmt(now.x)} %, adding ${fmt(now.y)} % to channel ${mix.to}${active ? '' : ' when it counts (not at these switch positions)'}.`;

  return (
    <Card className={cx('px-3 py-3', !active && 'bg-paper')}>
      <figure>
        <figcaption className="flex items-baseline justify-between gap-2">
          <span className="truncate font-mono text-sm font-medium text-ink-900" title={mix.id}>
            {mix.id}
          </span>
          <span className="shrink-0 text-xs text-ink-700">→ ch {mix.to}</span>
        </figcaption>
        <svg viewBox={`0 0 ${SIZE} ${SIZE}`} className="mt-1.5 block w-full" role="img" aria-label={label}>
          <rect
            x={PAD}
            y={PAD}
            width={inner}
            height={inner}
            rx={3}
            className="fill-paper stroke-ply-300"
            strokeWidth={1}
          />
          {limitsShown && (
            <g className="stroke-caution-700" strokeDasharray="3 3" strokeWidth={0.8}>
              <line x1={PAD} x2={SIZE - PAD} y1={sy(100)} y2={sy(100)} />
              <line x1={PAD} x2={SIZE - PAD} y1={sy(-100)} y2={sy(-100)} />
            </g>
          )}
          <g className="stroke-ply-300" strokeWidth={0.8}>
            <line x1={sx(0)} x2={sx(0)} y1={PAD} y2={SIZE - PAD} />
            <line x1={PAD} x2={SIZE - PAD} y1={sy(0)} y2={sy(0)} />
          </g>
          <polyline
            points={line}
            fill="none"
            className={active ? 'stroke-accent-700' : 'stroke-ink-500'}
            strokeWidth={2}
            strokeLinejoin="round"
            strokeDasharray={active ? undefined : '4 3'}
          />
          <line
            x1={sx(now.x)}
            x2={sx(now.x)}
            y1={PAD}
            y2={SIZE - PAD}
            className="stroke-caution-700"
            strokeWidth={0.8}
            strokeDasharray="2 2"
          />
          <circle
            cx={sx(now.x)}
            cy={sy(now.y)}
            r={3.5}
            className="fill-caution-700 stroke-paper-raised"
            strokeWidth={1.5}
          />
        </svg>
        <p className="mt-1 flex flex-wrap gap-x-2 text-xs text-ink-700">
          <span>weight {fmt(weight)} %</span>
          <span>expo {mix.expo} %</span>
          {mix.offset !== 0 && <span>offset {fmt(mix.offset)} %</span>}
          {mix.rates && <span>rates: {mix.rates.control}</span>}
        </p>
        <p className="text-xs text-ink-700">
          {inputName} {fmt(now.x)} → {fmt(now.y)} %
          {!active && <span className="ml-1 font-medium text-ink-900">· not counting here</span>}
        </p>
      </figure>
    </Card>
  );
}
