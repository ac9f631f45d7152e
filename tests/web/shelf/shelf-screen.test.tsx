import { screen, waitFor, within } from '@testing-library/react';
import { apiError, BUILDERS, CLUB, fakeServer, keysetPage, sessionRoutes } from '../fake-server';
import { uuid } from '../models/model-data';
import { renderApp } from '../render-app';
import { history, unitRecord } from './shelf-data';

const kestrel = { id: uuid(9100), name: 'Kestrel Mk II' };

const installedUnit = unitRecord('wing-unit', {
  status: 'installed',
  installed: { install_id: uuid(7100), model: kestrel, slot: 'wing', since: '2026-02-16T09:40:00.000Z' },
  readiness: { state: 'ready', changes: 0, revision: { id: uuid(1), number: 12 }, reason: null },
});
const changesUnit = unitRecord('trainer-unit', {
  status: 'installed',
  installed: {
    install_id: uuid(7100),
    model: { id: uuid(9100), name: 'Meadowlark 40' },
    slot: 'cabin',
    since: '2026-02-16T09:40:00.000Z',
  },
  readiness: { state: 'changes', changes: 3, revision: { id: uuid(1), number: 3 }, reason: null },
});
const spare = unitRecord(null, { label: 'Spare 8-output unit', mark_colour: 'orange' });

function shelfServer(units = [installedUnit, changesUnit, spare], ws = CLUB) {
  return fakeServer({
    ...sessionRoutes({ signedIn: true }).routes,
    [`GET /api/workspaces/${ws}/receivers`]: ({ url }) => {
      const q = url.searchParams.get('q')?.toLowerCase();
      const status = url.searchParams.get('status');
      const shown = units.filter(
        (unit) => (!q || unit.label.toLowerCase().includes(q)) && (!status || unit.status === status),
      );
      return keysetPage(shown, url);
    },
  });
}

const rowOf = (label: string) => screen.getByRole('row', { name: new RegExp(label) });

describe('Shelf', () => {
  it('lists each unit with its mark in words, outputs, where it is with its readiness, and telemetry', async () => {
    shelfServer();
    renderApp(`/w/${CLUB}/shelf`);
    const table = await screen.findByRole('table', { name: 'Receivers on this workspace’s shelf' });
    expect(
      within(table)
        .getAllByRole('columnheader')
        .map((cell) => cell.textContent),
    ).toEqual(['Receiver', 'Mark', 'Code', 'Outputs', 'Where installed', 'Telemetry']);

    const wing = within(rowOf('Kestrel wing unit'))
      .getAllByRole('cell')
      .map((cell) => cell.textContent);
    expect(wing).toEqual(['Kestrel wing unit', 'Red tape', 'K7QF3M', '8', 'Kestrel Mk II · slot wingReady', 'Off']);
    expect(within(rowOf('Pipit trainer unit')).getByText('3 changes to make')).toBeInTheDocument();
    expect(within(rowOf('Pipit trainer unit')).getByText('Sends')).toBeInTheDocument();
    // A colour without words still reads as words.
    const spareCells = within(rowOf('Spare 8-output unit'))
      .getAllByRole('cell')
      .map((cell) => cell.textContent);
    expect(spareCells).toEqual([
      'Spare 8-output unit',
      'orange (no words)',
      'K7QF3M',
      '8',
      'Free, on the shelf',
      'Not recorded',
    ]);
    expect(within(rowOf('Kestrel wing unit')).getByRole('link', { name: 'Kestrel wing unit' })).toHaveAttribute(
      'href',
      `/w/${CLUB}/shelf/${installedUnit.id}`,
    );
    expect(document.title).toBe(`Shelf · Hollowfield Aero Club · Bindery`);
  });

  it('searches and filters through the API, keeping both in the address', async () => {
    const server = shelfServer();
    const { user, location } = renderApp(`/w/${CLUB}/shelf`);
    await screen.findByRole('table');

    await user.click(screen.getByRole('radio', { name: 'Free' }));
    await waitFor(() => expect(screen.queryByText('Kestrel wing unit')).not.toBeInTheDocument());
    expect(screen.getByText('Spare 8-output unit')).toBeInTheDocument();
    expect(location().search).toBe('?status=free');

    await user.click(screen.getByRole('radio', { name: 'All' }));
    await user.type(screen.getByLabelText('Search receivers'), 'pipit');
    await waitFor(() => expect(screen.queryByText('Spare 8-output unit')).not.toBeInTheDocument());
    const asked = server.requests
      .filter((request) => request.path === `/api/workspaces/${CLUB}/receivers`)
      .map((request) => request.url.search);
    expect(asked).toContain('?limit=50&status=free');
    expect(asked.at(-1)).toBe('?limit=50&q=pipit');

    await user.type(screen.getByLabelText('Search receivers'), 'zzz');
    expect(await screen.findByRole('heading', { name: 'No receiver matches' })).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Show every receiver' }));
    expect(await screen.findByText('Kestrel wing unit')).toBeInTheDocument();
    expect(location().search).toBe('');
  });

  it('offers an editor the first unit of an empty shelf', async () => {
    shelfServer([]);
    renderApp(`/w/${CLUB}/shelf`);
    expect(await screen.findByRole('heading', { name: 'The shelf is empty' })).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Add the first receiver' })).toBeInTheDocument();
  });

  it('gives a reviewer no way to add a unit', async () => {
    shelfServer([spare], BUILDERS);
    renderApp(`/w/${BUILDERS}/shelf`);
    await screen.findByRole('table');
    expect(screen.queryByRole('button', { name: 'Add receiver' })).not.toBeInTheDocument();
    expect(screen.getByText(/Your role here is reviewer/)).toBeInTheDocument();
  });

  it('shows the server’s error when the shelf cannot be loaded', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      [`GET /api/workspaces/${CLUB}/receivers`]: () =>
        apiError(503, 'database-unavailable', 'The database is unavailable. Try again shortly.'),
    });
    renderApp(`/w/${CLUB}/shelf`);
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('The shelf could not be loaded');
    expect(alert).toHaveTextContent('The database is unavailable.');
  });

  it('adds a unit, showing the server’s word beside a refused field, then opens its page', async () => {
    const added = unitRecord(null, { label: 'Heron wing unit', mark: 'Orange dot', mark_colour: 'orange', outputs: 6 });
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      [`GET /api/workspaces/${CLUB}/receivers`]: () => ({ body: { data: [], pagination: { total: 0 } } }),
      [`POST /api/workspaces/${CLUB}/receivers`]: ({ body }) =>
        (body as { outputs: number }).outputs > 32
          ? apiError(400, 'invalid-input', 'Some fields need attention.', {
              fields: { outputs: 'At most 32 outputs.' },
            })
          : { status: 201, body: { data: added } },
      [`GET /api/receivers/${added.id}`]: () => ({ body: { data: added } }),
      [`GET /api/receivers/${added.id}/history`]: () => ({ body: { data: history } }),
    });
    const { user, location } = renderApp(`/w/${CLUB}/shelf`);
    await user.click(await screen.findByRole('button', { name: 'Add receiver' }));
    const dialog = screen.getByRole('dialog', { name: 'Add a receiver to the shelf' });
    await user.type(within(dialog).getByLabelText(/^Label/), 'Heron wing unit');
    await user.type(within(dialog).getByLabelText('Mark on the case'), 'Orange dot');
    await user.selectOptions(within(dialog).getByLabelText('Mark colour'), 'orange');
    await user.clear(within(dialog).getByLabelText('Outputs'));
    await user.type(within(dialog).getByLabelText('Outputs'), '40');
    await user.click(within(dialog).getByRole('button', { name: 'Add to the shelf' }));
    expect(await within(dialog).findByText('At most 32 outputs.')).toBeInTheDocument();

    await user.clear(within(dialog).getByLabelText('Outputs'));
    await user.type(within(dialog).getByLabelText('Outputs'), '6');
    await user.click(within(dialog).getByRole('button', { name: 'Add to the shelf' }));
    await waitFor(() => expect(location().pathname).toBe(`/w/${CLUB}/shelf/${added.id}`));
    expect(server.called('POST', `/api/workspaces/${CLUB}/receivers`).at(-1)!.body).toEqual({
      label: 'Heron wing unit',
      mark: 'Orange dot',
      mark_colour: 'orange',
      outputs: 6,
    });
    expect(await screen.findByRole('heading', { level: 1, name: 'Heron wing unit' })).toBeInTheDocument();
  });
});

describe('A shelf longer than a page', () => {
  // 70 units: a page of 50 and one of 20.
  const bay = () =>
    Array.from({ length: 70 }, (_, n) =>
      unitRecord(null, { id: uuid(7000), label: `Bay unit ${String(n + 1).padStart(2, '0')}` }),
    );
  const labelsShown = () =>
    within(screen.getByRole('table'))
      .getAllByRole('row')
      .slice(1)
      .map((row) => within(row).getAllByRole('link')[0].textContent);

  it('shows the first page with how many of how many, and Show more reads the next page by its cursor', async () => {
    const units = bay();
    const server = shelfServer(units);
    const { user } = renderApp(`/w/${CLUB}/shelf`);

    expect(await screen.findByText('Showing 50 of 70 receivers.')).toBeInTheDocument();
    expect(screen.getByText('70 receivers')).toBeInTheDocument();
    expect(labelsShown()).toHaveLength(50);

    await user.click(screen.getByRole('button', { name: 'Show more' }));
    await waitFor(() => expect(labelsShown()).toHaveLength(70));
    expect(labelsShown().slice(49, 51)).toEqual(['Bay unit 50', 'Bay unit 51']);
    expect(screen.queryByRole('button', { name: 'Show more' })).not.toBeInTheDocument();
    const asked = server.called('GET', `/api/workspaces/${CLUB}/receivers`).map((request) => request.url.searchParams);
    expect(asked.at(-1)?.get('after')).toBe(units[49].id);
  });

  it('asks the server to search, so a unit far past the first page is found', async () => {
    const server = shelfServer(bay());
    const { user } = renderApp(`/w/${CLUB}/shelf`);
    await screen.findByText('Showing 50 of 70 receivers.');

    await user.type(screen.getByLabelText('Search receivers'), 'unit 68');
    await waitFor(() => expect(labelsShown()).toEqual(['Bay unit 68']));
    expect(screen.getByText('1 receiver match')).toBeInTheDocument();
    const asked = server.called('GET', `/api/workspaces/${CLUB}/receivers`).map((request) => request.url.searchParams);
    expect(asked.at(-1)?.get('q')).toBe('unit 68');
  });
});
