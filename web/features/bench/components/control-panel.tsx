import { useId } from 'react';
import type { Control } from '@shared/format/schema';
import { controlValue } from '@shared/evaluate/control-value';
import { Card } from '../../../components/ui/card';
import { cx } from '../../../lib/cx';

export type Positions = Record<string, number>;

const signed = (value: number) => `${value > 0 ? '+' : value < 0 ? '−' : ''}${Math.abs(Math.round(value))}`;

export const controlName = (control: Control) => control.label ?? control.id;

function ProportionalControl({
  control,
  value,
  onChange,
}: {
  control: Control;
  value: number;
  onChange: (value: number) => void;
}) {
  const id = useId();
  return (
    <div>
      <div className="flex items-baseline justify-between gap-2">
        <label htmlFor={id} className="min-w-0 text-sm font-medium text-ink-900">
          {controlName(control)}
          {control.label && <span className="ml-1.5 font-mono text-xs font-normal text-ink-500">{control.id}</span>}
        </label>
        <output htmlFor={id} className="shrink-0 font-mono text-sm text-ink-900 tabular-nums">
          {signed(value)} %
        </output>
      </div>
      <input
        id={id}
        type="range"
        min={-100}
        max={100}
        step={1}
        value={value}
        onChange={(event) => onChange(Number(event.target.value))}
        onDoubleClick={() => onChange(0)}
        className="mt-1 block h-11 w-full accent-accent-700"
        aria-valuetext={`${signed(value)} percent`}
      />
      <p className="flex justify-between text-xs text-ink-500" aria-hidden="true">
        <span>−100</span>
        <span className="capitalize">{control.kind}</span>
        <span>+100</span>
      </p>
    </div>
  );
}

function SwitchControl({
  control,
  position,
  onChange,
}: {
  control: Control & { kind: 'switch' };
  position: number;
  onChange: (position: number) => void;
}) {
  const name = useId();
  return (
    <fieldset>
      <legend className="text-sm font-medium text-ink-900">
        {controlName(control)}
        {control.label && <span className="ml-1.5 font-mono text-xs font-normal text-ink-500">{control.id}</span>}
      </legend>
      <div className="mt-1 flex overflow-hidden rounded-md border border-ply-500">
        {Array.from({ length: control.positions }, (_, p) => {
          const checked = p === position;
          return (
            <label
              key={p}
              className={cx(
                'flex min-h-11 flex-1 cursor-pointer flex-col items-center justify-center border-ply-500 px-2 py-1 text-sm not-first:border-l has-focus-visible:outline-3 has-focus-visible:outline-accent-600',
                checked ? 'bg-accent-700 font-semibold text-white' : 'bg-paper-raised text-ink-900 hover:bg-ply-100',
              )}
            >
              <input
                type="radio"
                name={name}
                value={p}
                checked={checked}
                onChange={() => onChange(p)}
                className="sr-only"
              />
              <span>
                <span className="sr-only">Position </span>
                {p}
              </span>
              <span className={cx('font-mono text-xs', checked ? 'text-white' : 'text-ink-500')} aria-hidden="true">
                {signed(controlValue(control, p))}
              </span>
            </label>
          );
        })}
      </div>
    </fieldset>
  );
}

export interface ControlPanelProps {
  controls: readonly Control[];
  positions: Positions;
  onChange: (id: string, value: number) => void;
}

/** The transmitter's inputs under the pilot's own names: sliders for sticks, knobs and sliders, a row of positions per switch. */
export function ControlPanel({ controls, positions, onChange }: ControlPanelProps) {
  const headingId = useId();
  const proportional = controls.filter((control) => control.kind !== 'switch');
  const switches = controls.filter((control): control is Control & { kind: 'switch' } => control.kind === 'switch');
  return (
    <Card className="px-4 py-4">
      <section aria-labelledby={headingId}>
        <h2 id={headingId} className="text-lg font-semibold text-ink-900">
          Controls
        </h2>
        <div className="mt-3 space-y-4">
          {proportional.map((control) => (
            <ProportionalControl
              key={control.id}
              control={control}
              value={positions[control.id] ?? 0}
              onChange={(value) => onChange(control.id, value)}
            />
          ))}
        </div>
        {switches.length > 0 && (
          <div
            className={cx(
              'grid grid-cols-2 gap-x-3 gap-y-3 md:grid-cols-1 lg:grid-cols-2',
              proportional.length > 0 && 'mt-5 border-t border-ply-200 pt-4',
            )}
          >
            {switches.map((control) => (
              <SwitchControl
                key={control.id}
                control={control}
                position={positions[control.id] ?? 0}
                onChange={(value) => onChange(control.id, value)}
              />
            ))}
          </div>
        )}
      </section>
    </Card>
  );
}
