import { useId } from 'react';
import { Card } from '../../../components/ui/card';
import type { ChangedCurve } from '../changed-curves';

const SIZE = 120;
const PAD = 8;
/** The inputs the text table reads the curves at, in percent. */
const READ_AT = [-100, -75, -50, -25, 0, 25, 50, 75, 100];

const fmt = (value: number) => {
  const rounded = Math.round(value * 10) / 10;
  return `${rounded > 0 ? '+' : rounded < 0 ? '−' : ''}${Math.abs(rounded)}`;
};

export const curveTitle = (curve: ChangedCurve) =>
  `Mix ${curve.mixId} to channel ${curve.to}${curve.rates ? `, ${curve.rates.control} at position ${curve.rates.position}` : ''}: before and after`;

/**
 * A changed mix's response before and after, drawn on one small plot (input −100..+100 %
 * across, output up; before dashed, after solid), with the numbers as a table for anyone
 * who cannot see the plot.
 */
export function MixCurveChange({ curve }: { curve: ChangedCurve }) {
  const titleId = useId();
  const all = [...curve.before, ...curve.after];
  const reach = Math.max(100, ...all.map((point) => Math.abs(point.y)));
  const inner = SIZE - 2 * PAD;
  const sx = (x: number) => PAD + ((x + 100) / 200) * inner;
  const sy = (y: number) => PAD + ((reach - y) / (2 * reach)) * inner;
  const line = (points: ChangedCurve['before']) =>
    points.map((point) => `${sx(point.x).toFixed(1)},${sy(point.y).toFixed(1)}`).join(' ');
  const at = (points: ChangedCurve['before'], x: number) => points.find((point) => Math.abs(point.x - x) < 1e-9)?.y;
  const title = curveTitle(curve);

  return (
    <Card className="px-3 py-3">
      <figure>
        <figcaption className="text-sm font-medium text-ink-900">
          <span className="font-mono">{curve.mixId}</span> → ch {curve.to}
          {curve.rates && (
            <span className="block text-xs font-normal text-ink-700">
              {curve.rates.control} at position {curve.rates.position}
            </span>
          )}
        </figcaption>
        <svg
          viewBox={`0 0 ${SIZE} ${SIZE}`}
          className="mt-1.5 block w-full max-w-48"
          role="img"
          aria-labelledby={titleId}
        >
          <title id={titleId}>{title}</title>
          <rect
            x={PAD}
            y={PAD}
            width={inner}
            height={inner}
            rx={3}
            className="fill-paper stroke-ply-300"
            strokeWidth={1}
          />
          <g className="stroke-ply-300" strokeWidth={0.8}>
            <line x1={sx(0)} x2={sx(0)} y1={PAD} y2={SIZE - PAD} />
            <line x1={PAD} x2={SIZE - PAD} y1={sy(0)} y2={sy(0)} />
          </g>
          <polyline
            points={line(curve.before)}
            fill="none"
            className="stroke-ink-500"
            strokeWidth={1.5}
            strokeDasharray="4 3"
          />
          <polyline
            points={line(curve.after)}
            fill="none"
            className="stroke-accent-700"
            strokeWidth={2}
            strokeLinejoin="round"
          />
        </svg>
        <p className="mt-1 flex flex-wrap gap-x-3 text-xs text-ink-700">
          <span>
            <span aria-hidden="true">╌ </span>before
          </span>
          <span>
            <span aria-hidden="true" className="text-accent-700">
              ━{' '}
            </span>
            after
          </span>
        </p>
        <details className="mt-1 text-xs">
          <summary className="cursor-pointer text-accent-700">The numbers</summary>
          <table className="mt-1 w-full text-right font-mono tabular-nums">
            <caption className="sr-only">{title}, output in percent by input</caption>
            <thead className="text-ink-700">
              <tr>
                <th scope="col" className="font-medium">
                  input %
                </th>
                <th scope="col" className="font-medium">
                  before %
                </th>
                <th scope="col" className="font-medium">
                  after %
                </th>
              </tr>
            </thead>
            <tbody>
              {READ_AT.map((x) => {
                const before = at(curve.before, x);
                const after = at(curve.after, x);
                return (
                  <tr key={x}>
                    <th scope="row" className="font-normal">
                      {fmt(x)}
                    </th>
                    <td>{before === undefined ? '—' : fmt(before)}</td>
                    <td className={fmt(before ?? 0) !== fmt(after ?? 0) ? 'font-semibold text-ink-900' : undefined}>
                      {after === undefined ? '—' : fmt(after)}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </details>
      </figure>
    </Card>
  );
}
