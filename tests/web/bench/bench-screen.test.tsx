import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';
import { MODEL_ID, modelRoutes, revisionId, type StoredRevision } from '../editor/model-routes';
import { demoSetup, documentOf } from '../editor/setups';

const SLOW = { timeout: 20_000 };

const stored = (number: number, yaml: string, message: string): StoredRevision => ({
  id: revisionId(number),
  number,
  yaml,
  document: documentOf(yaml),
  message,
});
const r7 = stored(7, demoSetup, 'Lights on 10 and 11');

async function openBench(revisions: StoredRevision[] = [r7], path = `/models/${MODEL_ID}/bench`) {
  const server = fakeServer({
    ...sessionRoutes({ signedIn: true }).routes,
    ...modelRoutes(revisions),
    [`GET /api/models/${MODEL_ID}/revisions`]: () => ({
      body: { data: [...revisions].reverse().map(({ yaml: _y, document: _d, ...rest }) => rest), pagination: {} },
    }),
  });
  const app = renderApp(path);
  await screen.findByRole('region', { name: 'Controls' });
  return { ...app, server };
}

function pinRow(receiver: string, pin: number): HTMLElement {
  const table = within(screen.getByRole('region', { name: receiver })).getByRole('table');
  const row = within(table)
    .getAllByRole('row')
    .find((candidate) => within(candidate).queryAllByRole('cell')[0]?.textContent === String(pin));
  if (!row) throw new Error(`No row for pin ${pin} of ${receiver}`);
  return row;
}

const cells = (row: HTMLElement) =>
  within(row)
    .getAllByRole('cell')
    .map((cell) => cell.textContent);

describe('Bench', () => {
  it(
    'puts out every pin at centre with the sticks centred, and full aileron stick gives 2000 µs on pin 1',
    SLOW,
    async () => {
      await openBench();
      // Pin, channel, function, pulse now, failsafe.
      expect(cells(pinRow('Fuselage receiver (blue tape)', 1))).toEqual([
        '1',
        '1',
        'aileron-left',
        '1500',
        'live',
        '1500 µs',
      ]);

      fireEvent.change(screen.getByRole('slider', { name: 'aileron-stick' }), { target: { value: '100' } });

      // docs/format.md evaluation: curve(1) = 1 at any expo; default travel puts +100 % at high_us.
      await waitFor(() => expect(cells(pinRow('Fuselage receiver (blue tape)', 1))[3]).toBe('2000'));
      // Channel 6, the right aileron, is reversed: the same stick sends it to low_us.
      expect(cells(pinRow('Fuselage receiver (blue tape)', 6))[3]).toBe('1000');
      expect(screen.getByRole('slider', { name: 'aileron-stick' })).toHaveAttribute('aria-valuetext', '+100 percent');
    },
  );

  it('follows the rate switch: the low rate of 60 % gives 1800 µs at full stick', SLOW, async () => {
    const { user } = await openBench();
    fireEvent.change(screen.getByRole('slider', { name: 'aileron-stick' }), { target: { value: '100' } });
    const rates = screen.getByRole('group', { name: 'rate-switch' });
    await user.click(within(rates).getByRole('radio', { name: /Position 1/ }));
    // 1500 + 0.60 * 500 by the evaluation rules of docs/format.md.
    await waitFor(() => expect(cells(pinRow('Fuselage receiver (blue tape)', 1))[3]).toBe('1800'));
  });

  it('starts at rest: the throttle stick at its stop, every pin live', SLOW, async () => {
    await openBench();
    // Evaluation rule 8 (docs/format.md, second edition): a control feeding a `stop: low`
    // throttle rests at -100, so the motor pin reads low_us, not the 1500 µs of mid stick.
    expect(screen.getByRole('slider', { name: 'throttle-stick' })).toHaveValue('-100');
    // Pin, channel, function, pulse, state, failsafe.
    expect(cells(pinRow('Fuselage receiver (blue tape)', 3))).toEqual(['3', '3', 'motor', '1000', 'live', '1000 µs']);
    expect(screen.getByRole('button', { name: 'Put everything at rest' })).toBeDisabled();
  });

  it(
    "shows the motor cut by the arm switch, then every pin's failsafe when every receiver loses the link",
    SLOW,
    async () => {
      const { user } = await openBench();
      fireEvent.change(screen.getByRole('slider', { name: 'throttle-stick' }), { target: { value: '100' } });
      // Arm switch at position 0: the cut holds the motor at -100 %.
      expect(cells(pinRow('Fuselage receiver (blue tape)', 3))[3]).toBe('1000');
      expect(within(screen.getByRole('region', { name: 'Channels' })).getByText('cut on')).toBeInTheDocument();

      await user.click(
        within(screen.getByRole('group', { name: /^Arm \(guarded\)/ })).getByRole('radio', { name: /Position 1/ }),
      );
      await waitFor(() => expect(cells(pinRow('Fuselage receiver (blue tape)', 3))[3]).toBe('2000'));

      await user.click(screen.getByRole('button', { name: 'Lose every receiver' }));
      expect(cells(pinRow('Fuselage receiver (blue tape)', 3))).toEqual([
        '3',
        '3',
        'motor',
        '1000',
        'failsafe (1000 µs)',
        '1000 µs',
      ]);
      // Gear holds: the pulse it had when the link went (the switch at position 0, 1000 µs).
      expect(cells(pinRow('Fuselage receiver (blue tape)', 5))).toEqual([
        '5',
        '5',
        'gear',
        '1000',
        'held',
        'holds last pulse',
      ]);
      expect(cells(pinRow('Wing receiver (red tape)', 7))).toEqual([
        '7',
        '15',
        'cowl-flaps',
        '1500',
        'failsafe (1500 µs)',
        '1500 µs',
      ]);
      expect(screen.getByRole('checkbox', { name: 'Wing receiver (red tape) loses the link' })).toBeChecked();

      await user.click(screen.getByRole('button', { name: 'Bring the link back' }));
      await user.click(screen.getByRole('button', { name: 'Put everything at rest' }));
      expect(cells(pinRow('Fuselage receiver (blue tape)', 3))[3]).toBe('1000');
      expect(cells(pinRow('Fuselage receiver (blue tape)', 3))[4]).toBe('live');
      expect(screen.getByRole('slider', { name: 'throttle-stick' })).toHaveValue('-100');
    },
  );

  it('loses one receiver while the other keeps the link and follows the sticks', SLOW, async () => {
    const { user } = await openBench();
    fireEvent.change(screen.getByRole('slider', { name: 'aileron-stick' }), { target: { value: '100' } });
    fireEvent.change(screen.getByRole('slider', { name: 'rudder-stick' }), { target: { value: '100' } });
    await user.click(screen.getByRole('checkbox', { name: 'Wing receiver (red tape) loses the link' }));

    // The wing unit sends its failsafes: the tailwheel's pin 1 goes to 1500 µs though the rudder is at full.
    expect(cells(pinRow('Wing receiver (red tape)', 1))).toEqual([
      '1',
      '9',
      'tailwheel',
      '1500',
      'failsafe (1500 µs)',
      '1500 µs',
    ]);
    // The fuselage unit keeps the link: full aileron still gives 2000 µs on its pin 1.
    expect(cells(pinRow('Fuselage receiver (blue tape)', 1))).toEqual([
      '1',
      '1',
      'aileron-left',
      '2000',
      'live',
      '1500 µs',
    ]);
    expect(screen.getByText(/has lost the link/)).toHaveTextContent(
      /Wing receiver \(red tape\) has lost the link.*The other receivers keep the link/,
    );
    expect(screen.getByRole('button', { name: 'Lose every receiver' })).toBeInTheDocument();
  });

  it(
    'says "no pulses" for a pin set to stop pulses and "receiver default" for one with no failsafe',
    SLOW,
    async () => {
      const yaml = demoSetup
        .replace('{ pin: 8, ch: 8, failsafe: 1500 }', '{ pin: 8, ch: 8, failsafe: off }')
        .replace('{ pin: 7, ch: 7, failsafe: 1500 }', '{ pin: 7, ch: 7 }');
      const { user } = await openBench([stored(7, yaml, 'Pins 7 and 8 left to the unit')]);
      await user.click(screen.getByRole('checkbox', { name: 'Fuselage receiver (blue tape) loses the link' }));
      expect(cells(pinRow('Fuselage receiver (blue tape)', 8)).slice(3)).toEqual(['none', 'no pulses', 'stops pulses']);
      expect(cells(pinRow('Fuselage receiver (blue tape)', 7)).slice(3)).toEqual([
        'none',
        'receiver default (not known)',
        'receiver default',
      ]);
    },
  );

  it('draws each mix as a curve with the stick position marked', SLOW, async () => {
    await openBench();
    const curves = screen.getByRole('region', { name: 'Mix curves' });
    expect(within(curves).getAllByRole('img')).toHaveLength(17);
    fireEvent.change(screen.getByRole('slider', { name: 'elevator-stick' }), { target: { value: '50' } });
    // weight 92, expo 15: 92 * (0.85 * 0.5 + 0.15 * 0.125) = 40.8 % [expo-cubic]
    const elevator = within(curves).getByRole('img', {
      name: /^Curve of mix elevator: weight \+92 %, expo 15 %, offset 0 %; input elevator-stick now at \+50 %, adding \+41 % to channel 2\.$/,
    });
    const caption = within(elevator.closest('figure')!);
    expect(caption.getByText('weight +92 %')).toBeInTheDocument();
    expect(caption.getByText('expo 15 %')).toBeInTheDocument();
  });

  it('puts an older revision on the bench when ?revision= names it', SLOW, async () => {
    const r8 = stored(
      8,
      demoSetup.replace(
        '{ id: tailwheel,  from: rudder-stick,   to: 9, weight: 80 }',
        '{ id: tailwheel,  from: rudder-stick,   to: 9, weight: -80 }',
      ),
      'Tailwheel the other way',
    );
    await openBench([r7, r8], `/models/${MODEL_ID}/bench?revision=${r7.id}`);
    fireEvent.change(screen.getByRole('slider', { name: 'rudder-stick' }), { target: { value: '100' } });
    await waitFor(() => expect(cells(pinRow('Wing receiver (red tape)', 1))[3]).toBe('1900'));
    expect(screen.getByLabelText('Revision')).toHaveValue(r7.id);
  });
});
