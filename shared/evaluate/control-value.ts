import type { Control } from '../format/schema';

export type Positions = Readonly<Record<string, number>>;

function finiteOr(value: number | undefined, fallback: number): number {
  return typeof value === 'number' && Number.isFinite(value) ? value : fallback;
}

/** A switch position, rounded and kept within the switch's positions. */
export function clampPosition(control: Control & { kind: 'switch' }, position: number | undefined): number {
  const p = Math.round(finiteOr(position, 0));
  return Math.min(control.positions - 1, Math.max(0, p));
}

/**
 * A control's value in percent: axes, knobs and sliders take the given percent
 * (clamped to -100..100); a switch with n positions at position p is worth
 * -100 + 200 p / (n - 1).
 */
export function controlValue(control: Control, position: number | undefined): number {
  if (control.kind === 'switch') {
    const p = clampPosition(control, position);
    return -100 + (200 * p) / (control.positions - 1);
  }
  return Math.min(100, Math.max(-100, finiteOr(position, 0)));
}

/**
 * The position of the switch `id`. A reference to a missing control or to one that is
 * not a switch (both reported by checks) counts as position 0, so that evaluation
 * still gives an answer for a setup with such errors.
 */
export function switchPositionOf(controls: ReadonlyMap<string, Control>, id: string, positions: Positions): number {
  const control = controls.get(id);
  if (!control || control.kind !== 'switch') return 0;
  return clampPosition(control, positions[id]);
}

/** The first control of each id; later duplicates are reported by `duplicate-id`. */
export function controlsById(controls: readonly Control[]): Map<string, Control> {
  const byId = new Map<string, Control>();
  for (const control of controls) if (!byId.has(control.id)) byId.set(control.id, control);
  return byId;
}
