import { screen, waitFor, within } from '@testing-library/react';
import { fakeServer, sessionRoutes } from '../fake-server';
import { fixtureText, modelRecord, modelRoutes } from '../models/model-data';
import { renderApp } from '../render-app';

function openCompare(pair: string, search = '') {
  const model = modelRecord('Kestrel Twin', [
    fixtureText(`pairs/${pair}.before.yaml`),
    fixtureText(`pairs/${pair}.after.yaml`),
  ]);
  const server = fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...modelRoutes([model]) });
  const app = renderApp(`/models/${model.id}/compare${search}`);
  return { model, server, ...app };
}

/** Each section group of the change list: its heading, its count line and the sentences in it. */
function groups() {
  const region = screen.getByRole('region', { name: 'Changes by section' });
  return within(region)
    .getAllByRole('group')
    .map((group) => ({
      section: within(group).getByRole('heading', { level: 3 }).textContent,
      summary: group.querySelector('summary')!.textContent,
      sentences: within(group)
        .getAllByRole('listitem')
        .map((item) => item.querySelector('p')!.textContent),
    }));
}

describe('Compare', () => {
  it('compares the latest revision with the one before it when the address names none', async () => {
    const { model, server } = openCompare('renames');
    await screen.findByRole('region', { name: 'Changes by section' });
    const asked = server.called('GET', '/api/compare')[0].url.searchParams;
    expect([asked.get('from'), asked.get('to')]).toEqual([model.revisions[0].id, model.revisions[1].id]);
    expect(screen.getByRole('combobox', { name: 'Older (from)' })).toHaveValue(model.revisions[0].id);
    expect(screen.getByRole('combobox', { name: 'Newer (to)' })).toHaveValue(model.revisions[1].id);
  });

  it('groups the changes by section in the format’s order, with counts, and folds the unchanged sections', async () => {
    openCompare('renames');
    await screen.findByRole('region', { name: 'Changes by section' });

    const shown = groups();
    expect(shown.map((group) => group.section)).toEqual([
      'Controls',
      'Channel plan',
      'Mixes',
      'Receivers and pin maps',
    ]);
    const mixes = shown.find((group) => group.section === 'Mixes')!;
    expect(mixes.summary).toContain('3 changes');
    expect(mixes.summary).toContain('2 changed');
    expect(mixes.summary).toContain('1 renamed');
    expect(mixes.sentences).toEqual([
      'Mix gear: input gear-switch -> retract-switch',
      'Mix gear: target channel 5 (gear) -> 9 (gear)',
      'Mix flap-trim renamed to camber-trim',
    ]);
    expect(shown.find((group) => group.section === 'Controls')!.sentences).toEqual([
      'Control gear-switch renamed to retract-switch',
    ]);
    expect(screen.getByText('Unchanged: Format, Model, Link, Power.')).toBeInTheDocument();
  });

  it('shows each change’s path and its before -> after', async () => {
    openCompare('remap-second-receiver');
    await screen.findByRole('region', { name: 'Changes by section' });
    const receivers = groups();
    expect(receivers.map((group) => group.section)).toEqual(['Receivers and pin maps']);
    const pin3 = screen.getByText('receivers[id=wing].map[pin=3].ch').closest('li')!;
    expect(pin3).toHaveTextContent('Wing receiver pin 3: channel 3 (motor) -> 11 (bay-door)');
    expect(pin3).toHaveTextContent('3 -> 11');
  });

  it('lists what now moves differently and the findings the newer revision brought', async () => {
    openCompare('remap-second-receiver');
    const outputs = await screen.findByRole('table', { name: /Receiver pins whose output differs/ });
    // The fixture remaps the wing receiver's pin 3 from channel 3 to 11.
    const cells = within(outputs)
      .getAllByRole('row')
      .map((row) =>
        within(row)
          .queryAllByRole('cell')
          .map((cell) => cell.textContent),
      );
    expect(cells.some(([receiver, pin, channel]) => receiver === 'wing' && pin === '3' && channel === '3 -> 11')).toBe(
      true,
    );
    const introduced = screen.getByRole('heading', { name: /^Introduced/ }).parentElement!;
    expect(within(introduced).getByText(/bay-door/)).toBeInTheDocument();
  });

  it('follows a new choice of revision into the address', async () => {
    const { model, user, location } = openCompare('trim-tuning');
    await screen.findByRole('region', { name: 'Changes by section' });
    await user.click(screen.getByRole('button', { name: 'Swap' }));
    await waitFor(() => expect(location().search).toBe(`?from=${model.revisions[1].id}&to=${model.revisions[0].id}`));
    expect(screen.getByRole('link', { name: 'Download the changes as a patch file (JSON)' })).toHaveAttribute(
      'href',
      `/api/revisions/${model.revisions[0].id}/patch?from=${model.revisions[1].id}&download=1`,
    );
  });

  it('fetches the YAML text difference only when the reader opens it', async () => {
    const { server, user } = openCompare('trim-tuning');
    await screen.findByRole('region', { name: 'Changes by section' });
    expect(server.called('GET', '/api/compare/text')).toHaveLength(0);
    await user.click(screen.getByText('Show the line-by-line difference'));
    expect((await screen.findAllByText(/only in/)).length).toBeGreaterThan(0);
    expect(server.called('GET', '/api/compare/text')).toHaveLength(1);
  });
});

describe('Compare: what now moves differently', () => {
  const demo = fixtureText('valid/scale-16-channel-two-receivers.yaml');

  function openPair(before: string, after: string, extra: Record<string, unknown> = {}) {
    const model = modelRecord('Kestrel Mk II', [before, after]);
    const routes = modelRoutes([model]);
    const compare = routes['GET /api/compare'];
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...routes,
      'GET /api/compare': (request) => {
        const answer = compare(request) as { body: { data: Record<string, unknown> } };
        return { body: { data: { ...answer.body.data, ...extra } } };
      },
    });
    renderApp(`/models/${model.id}/compare`);
    return { model, server };
  }

  const rowsOf = (table: HTMLElement) =>
    within(table)
      .getAllByRole('row')
      .map((row) =>
        within(row)
          .queryAllByRole('cell')
          .map((cell) => cell.textContent.replace('->', '').trim()),
      )
      .filter((cells) => cells.length > 0);

  it('lists the elevator pin when only the elevator expo changed, and plots the curve before and after', async () => {
    openPair(demo, demo.replace('to: 2, weight: 92, expo: 15 }', 'to: 2, weight: 92, expo: 20 }'));
    const table = await screen.findByRole('table', { name: /Receiver pins whose output differs/ });
    const rows = rowsOf(table);
    // Only the fuselage receiver's pin 2 (channel 2, elevator) moves differently, with the link up,
    // somewhere inside the stick's travel: expo leaves the ends and the centre where they were.
    expect(rows.length).toBeGreaterThan(0);
    expect(
      rows.every(([receiver, pin, channel, link]) => [receiver, pin, channel, link].join() === 'fuselage,2,2,up'),
    ).toBe(true);

    const plot = await screen.findByRole('img', { name: 'Mix elevator to channel 2: before and after' });
    const figure = within(plot.closest('figure')!);
    const numbers = figure.getByRole('table', { name: /Mix elevator to channel 2: before and after, output/ });
    const at50 = within(numbers)
      .getAllByRole('row')
      .find((row) => within(row).queryByRole('rowheader')?.textContent === '+50')!;
    // weight 92: 92 * (0.85 * 0.5 + 0.15 * 0.125) = 40.8 % before, 92 * (0.8 * 0.5 + 0.2 * 0.125) = 39.1 % after [expo-cubic]
    expect(
      within(at50)
        .getAllByRole('cell')
        .map((cell) => cell.textContent),
    ).toEqual(['+40.8', '+39.1']);
  });

  it('plots a changed low rate at the rate switch’s position 1 only', async () => {
    const low60 = demo;
    const low65 = demo.replaceAll('weights: [100, 60]', 'weights: [100, 65]');
    openPair(low65, low60);
    const plot = await screen.findByRole('img', {
      name: 'Mix ail-left to channel 1, rate-switch at position 1: before and after',
    });
    expect(plot).toBeInTheDocument();
    expect(screen.queryByRole('img', { name: /rate-switch at position 0/ })).not.toBeInTheDocument();
    const table = screen.getByRole('table', { name: /Receiver pins whose output differs/ });
    // The position names the rate switch, so the pilot can put it there on the bench.
    expect(within(table).getAllByRole('columnheader', { name: /rate-switch at position 1/ }).length).toBeGreaterThan(0);
  });

  it('names the lost receiver when a failsafe changed', async () => {
    openPair(demo, demo.replace('{ pin: 1, ch: 9,  failsafe: 1500 }', '{ pin: 1, ch: 9,  failsafe: 1000 }'));
    const table = await screen.findByRole('table', { name: /Receiver pins whose output differs/ });
    expect(rowsOf(table)).toEqual([['wing', '1', '9', 'wing lost', '1500 µs (failsafe)', '1000 µs (failsafe)']]);
    expect(within(table).getByRole('columnheader', { name: /Wing receiver \(red tape\) lost/ })).toBeInTheDocument();
  });

  it('shows the checks between the two revisions when the compare lists them', async () => {
    openPair(demo, demo.replace('{ pin: 1, ch: 9,  failsafe: 1500 }', '{ pin: 1, ch: 9,  failsafe: 1000 }'), {
      change_findings: [
        {
          rule: 'failsafe-meaning-changed',
          severity: 'warning',
          path: 'receivers[id=wing].map[pin=1].failsafe',
          message: 'Channel 9’s travel changed but wing pin 1 still fails safe to 1000 µs.',
          hint: 'Work the failsafe out again for the new travel.',
        },
      ],
    });
    const panel = await screen.findByRole('region', { name: 'Between these revisions (1)' });
    expect(panel).toHaveTextContent('still fails safe to 1000 µs');
    expect(panel).toHaveTextContent('failsafe-meaning-changed');
    expect(panel).toHaveTextContent('receivers[id=wing].map[pin=1].failsafe');
  });
});
