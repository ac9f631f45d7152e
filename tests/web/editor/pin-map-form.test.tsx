import { screen, waitFor, within } from '@testing-library/react';
import { analyzeSetup } from '@shared/analyze';
import { fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';
import { editorView } from './code-editor';
import { MODEL_ID, modelRoutes, revisionId } from './model-routes';
import { copiedWingSetup, documentOf } from './setups';

const SLOW = { timeout: 20_000 };

async function openPinMaps() {
  const revision = {
    id: revisionId(3),
    number: 3,
    yaml: copiedWingSetup,
    document: documentOf(copiedWingSetup),
    message: 'Second receiver',
  };
  fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...modelRoutes([revision]) });
  const app = renderApp(`/models/${MODEL_ID}/edit`);
  await waitFor(() => expect(document.querySelector('.cm-editor')).not.toBeNull());
  await app.user.click(screen.getByRole('tab', { name: 'Pin maps' }));
  const wing = screen.getByRole('region', { name: 'Wing receiver (red tape)' });
  return { ...app, wing };
}

const text = () => editorView().state.doc.toString();
const wingChannels = (yaml: string) =>
  (analyzeSetup(yaml).data as { receivers: { map: { ch: number }[] }[] }).receivers[1].map.map((entry) => entry.ch);

// A draft outlives the screen in sessionStorage, as it should; each test starts without one.
beforeEach(() => sessionStorage.clear());

describe('Edit: the pin-map form', () => {
  it(
    'shifts the ticked pins 1-8 of a copied receiver onto channels 9-16, in the text, comments kept',
    SLOW,
    async () => {
      const { user, wing } = await openPinMaps();
      const checks = screen.getByRole('complementary', { name: 'Checks' });
      expect(await within(checks).findAllByText('function-unrouted')).toHaveLength(8);

      await user.click(within(wing).getByRole('checkbox', { name: 'Select every pin of Wing receiver (red tape)' }));
      const by = within(wing).getByLabelText('Shift these pins’ channels by');
      await user.clear(by);
      await user.type(by, '8');
      await user.click(within(wing).getByRole('button', { name: 'Shift 8 pins' }));

      expect(within(wing).getByText('Pins 1-8 now carry channels 9-16.')).toBeInTheDocument();
      expect(within(wing).getByLabelText('Channel of pin 1 of wing')).toHaveValue('9');
      expect(within(wing).getByLabelText('Channel of pin 8 of wing')).toHaveValue('16');

      await waitFor(() => expect(wingChannels(text())).toEqual([9, 10, 11, 12, 13, 14, 15, 16]));
      const after = text();
      expect(after).toContain('      - { pin: 1, ch: 9,  failsafe: 1500 }\n');
      expect(after).toContain('      - { pin: 3, ch: 3, failsafe: 1000 }   # motor must stop on signal loss\n');
      expect(after).toContain('    telemetry: false          # only the fuselage receiver reports\n');
      expect(after).toContain('# The demo: a 16-channel scale model flown on two 8-output receivers bound to one');
      // Only the eight wing map lines differ from the text before the shift.
      const before = copiedWingSetup.split('\n');
      const changed = after.split('\n').flatMap((line, index) => (line === before[index] ? [] : [index + 1]));
      expect(changed).toHaveLength(8);
      expect(fuselageUnchanged(after)).toBe(true);

      await waitFor(() => expect(within(checks).queryByText('function-unrouted')).not.toBeInTheDocument());
    },
  );

  it('refuses a shift that would leave the channel range and changes nothing', SLOW, async () => {
    const { user, wing } = await openPinMaps();
    await user.click(within(wing).getByRole('checkbox', { name: 'Select pin 8 of wing' }));
    const by = within(wing).getByLabelText('Shift these pins’ channels by');
    await user.clear(by);
    await user.type(by, '30');
    await user.click(within(wing).getByRole('button', { name: 'Shift 1 pin' }));

    expect(within(wing).getByText('Channel 8 of pin 8 would become 38; channels go from 1 to 32.')).toBeInTheDocument();
    expect(text()).toBe(copiedWingSetup);
  });

  it('sets a failsafe from the form and takes it away again', SLOW, async () => {
    const { user, wing } = await openPinMaps();
    await user.selectOptions(within(wing).getByLabelText('Failsafe of pin 2 of wing'), 'Off (no pulses)');

    await waitFor(() => expect(text()).toContain('      - { pin: 2, ch: 2,  failsafe: off }\n'));

    await user.selectOptions(
      within(wing).getByLabelText('Failsafe of pin 2 of wing'),
      "Not set (the receiver's own default)",
    );
    await waitFor(() => expect(text()).toContain('      - { pin: 2, ch: 2 }\n'));

    await user.selectOptions(within(wing).getByLabelText('Failsafe of pin 2 of wing'), 'Pulse (µs)');
    const pulse = within(wing).getByLabelText('Failsafe pulse of pin 2 of wing in microseconds');
    await user.clear(pulse);
    await user.type(pulse, '1100{Enter}');
    await waitFor(() => expect(text()).toContain('      - { pin: 2, ch: 2, failsafe: 1100 }\n'));
  });
});

function fuselageUnchanged(after: string): boolean {
  const part = (yaml: string) => yaml.slice(yaml.indexOf('  - id: fuselage'), yaml.indexOf('  - id: wing'));
  return part(after) === part(copiedWingSetup);
}
