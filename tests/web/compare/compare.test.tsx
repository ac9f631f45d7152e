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
    expect(screen.getByRole('link', { name: 'Export JSON Patch' })).toHaveAttribute(
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
