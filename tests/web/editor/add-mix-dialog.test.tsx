import { readFileSync } from 'node:fs';
import path from 'node:path';
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { parse } from 'yaml';
import { vi } from 'vitest';
import { AddMixDialog } from '@web/features/editor/components/add-mix-dialog';

// The trainer: its sticks feed mixes, rate-switch switches the aileron and elevator rates,
// motor-arm is the motor's cut. Every control already does something.
const trainer = parse(readFileSync(path.resolve('fixtures/valid/trainer-single-receiver.yaml'), 'utf8')) as {
  controls: { id: string; kind: string }[];
  mixes: Record<string, unknown>[];
};

function open(data: typeof trainer) {
  const onAdd = vi.fn();
  render(<AddMixDialog data={data} controls={data.controls} onAdd={onAdd} onClose={() => undefined} />);
  const dialog = screen.getByRole('dialog', { name: 'Add a mix' });
  const from = within(dialog).getByLabelText<HTMLSelectElement>('From control');
  const labels = () => Object.fromEntries([...from.options].map((option) => [option.value, option.textContent]));
  return { dialog, from, labels, onAdd, user: userEvent.setup() };
}

describe('Add a mix: which controls are in use', () => {
  it('counts a control that switches dual rates or the cut as in use, not only one a mix moves with', () => {
    const { labels } = open(trainer);
    expect(labels()).toMatchObject({
      'aileron-stick': 'aileron-stick (used by a mix)',
      'throttle-stick': 'throttle-stick (used by a mix)',
      'rate-switch': 'rate-switch (used by dual rates)',
      'motor-arm': 'motor-arm (used by the cut)',
    });
    expect(Object.values(labels()).some((label) => label?.includes('not used yet'))).toBe(false);
  });

  it('proposes no control when every one is in use: it asks, and refuses to add until one is chosen', async () => {
    const { dialog, from, onAdd, user } = open(trainer);
    expect(from.value).toBe('');
    expect(within(dialog).getByText(/Every control already does something/)).toBeInTheDocument();

    await user.click(within(dialog).getByRole('button', { name: 'Add the mix' }));
    expect(onAdd).not.toHaveBeenCalled();
    expect(within(dialog).getByText('Choose the control this mix moves with.')).toBeInTheDocument();
    expect(from).toHaveAccessibleDescription(/Choose the control this mix moves with/);

    await user.selectOptions(from, 'rate-switch');
    expect(within(dialog).queryByText('Choose the control this mix moves with.')).not.toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Add the mix' }));
    expect(onAdd).toHaveBeenCalledWith({ from: 'rate-switch', to: 5 });
  });

  it('proposes the control nothing uses, and names every use of a control that has several', async () => {
    const data = {
      ...trainer,
      controls: [...trainer.controls, { id: 'spare-knob', kind: 'knob' }],
      mixes: [
        ...trainer.mixes,
        { id: 'flap', from: 'rate-switch', to: 6, active: { control: 'motor-arm', positions: [1] } },
      ],
    };
    const { dialog, from, labels, onAdd, user } = open(data);
    expect(from.value).toBe('spare-knob');
    expect(labels()).toMatchObject({
      'spare-knob': 'spare-knob (not used yet)',
      'rate-switch': 'rate-switch (used by dual rates and a mix)',
      'motor-arm': 'motor-arm (used by a mix’s switch and the cut)',
    });
    expect(Object.keys(labels())).not.toContain('');
    expect(within(dialog).queryByText(/Every control already does something/)).not.toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Add the mix' }));
    expect(onAdd).toHaveBeenCalledWith({ from: 'spare-knob', to: 5 });
  });
});
