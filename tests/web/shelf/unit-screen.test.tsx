import { screen, waitFor, within } from '@testing-library/react';
import { BUILDERS, CLUB, fakeServer, keysetPage, sessionRoutes, type FakeHandler } from '../fake-server';
import { fixtureText, modelRecord, modelRoutes, modelView } from '../models/model-data';
import { renderApp } from '../render-app';
import { checkFor, history, unitRecord } from './shelf-data';
import type { ShelfUnit } from '@web/features/shelf/types';

const kestrel = modelRecord('Kestrel Mk II', [fixtureText('valid/scale-16-channel-two-receivers.yaml')]);

/** The receiver routes over one unit whose record the handlers may change, as the server would. */
function unitRoutes(state: { unit: ShelfUnit }, extra: Record<string, FakeHandler> = {}): Record<string, FakeHandler> {
  const id = state.unit.id;
  return {
    ...sessionRoutes({ signedIn: true }).routes,
    ...modelRoutes([kestrel]),
    [`GET /api/workspaces/${state.unit.workspace_id}/models`]: () => ({
      body: { data: [modelView(kestrel)], pagination: { total: 1 } },
    }),
    [`GET /api/receivers/${id}`]: () => ({ body: { data: state.unit } }),
    [`GET /api/receivers/${id}/history`]: () => ({ body: { data: history } }),
    [`GET /api/receivers/${id}/reuse-check`]: ({ url }) => ({
      body: { data: checkFor(state.unit, kestrel, url.searchParams.get('slot')!) },
    }),
    ...extra,
  };
}

function installedIn(unit: ShelfUnit, slot: string): ShelfUnit {
  return {
    ...unit,
    status: 'installed',
    installed: {
      install_id: 'stay-1',
      model: { id: kestrel.id, name: kestrel.name },
      slot,
      since: '2026-04-21T10:00:00.000Z',
    },
  };
}

describe('A unit’s page', () => {
  it('shows the settings it holds, pin by pin', async () => {
    const state = { unit: unitRecord('trainer-unit') };
    fakeServer(unitRoutes(state));
    renderApp(`/w/${CLUB}/shelf/${state.unit.id}`);
    const table = await screen.findByRole('table', { name: 'Stored settings per output pin' });
    const pin3 = within(table).getAllByRole('row')[3];
    expect(
      within(pin3)
        .getAllByRole('cell')
        .map((cell) => cell.textContent),
    ).toEqual(['3', '3', '988 µs']);
    expect(screen.getByText(/Telemetry:/)).toHaveTextContent('Telemetry: sends');
    expect(screen.getByText('Free, on the shelf.')).toBeInTheDocument();
  });

  it('previews the reuse check for a chosen slot, with the cautions, then installs the unit there', async () => {
    const state = { unit: unitRecord('trainer-unit') };
    const server = fakeServer(
      unitRoutes(state, {
        [`POST /api/receivers/${state.unit.id}/install`]: ({ body }) => {
          state.unit = installedIn(state.unit, (body as { slot: string }).slot);
          const check = checkFor(state.unit, kestrel, 'wing');
          return { status: 201, body: { data: { ...check, receiver: state.unit, install: {}, moved_from: null } } };
        },
      }),
    );
    const { user } = renderApp(`/w/${CLUB}/shelf/${state.unit.id}`);
    await user.click(await screen.findByRole('button', { name: 'Install into a model' }));
    await user.selectOptions(screen.getByLabelText('Model'), kestrel.id);
    await waitFor(() => expect(screen.getByRole('option', { name: /^wing · Wing receiver/ })).toBeInTheDocument());
    await user.selectOptions(screen.getByLabelText('As which receiver of the setup'), 'wing');

    const list = await screen.findByRole('group', { name: 'What would have to change on the unit' });
    expect(within(list).getByText('Pin 3: carries channel 3, must carry channel 11')).toBeInTheDocument();
    expect(within(list).getByText('Pin 3: failsafe 988 µs, set hold')).toBeInTheDocument();
    expect(within(list).getByText('Telemetry: on, switch it off')).toBeInTheDocument();
    // A preview is a list to read, not yet a list to tick.
    expect(within(list).queryByRole('checkbox')).not.toBeInTheDocument();
    // Binding the unit to this transmitter may reset what it stores, so the list is checked again after.
    expect(screen.getByText(/Re-binding a unit can clear its stored settings/)).toHaveTextContent(
      'check the settings listed here again after binding',
    );
    expect(screen.getByRole('region', { name: 'Cautions before programming or flying' })).toHaveTextContent(
      'not a certification',
    );

    await user.click(screen.getByRole('button', { name: 'Install it here' }));
    await waitFor(() => expect(server.called('POST', `/api/receivers/${state.unit.id}/install`)).toHaveLength(1));
    expect(server.called('POST', `/api/receivers/${state.unit.id}/install`)[0].body).toEqual({
      model: kestrel.id,
      slot: 'wing',
      move: false,
    });
    expect(await screen.findByRole('heading', { name: 'Before it flies in Kestrel Mk II' })).toBeInTheDocument();
  });

  it('finds the model to install into by the server’s search, far down a hangar too long to list', async () => {
    const state = { unit: unitRecord('trainer-unit') };
    const yaml = fixtureText('valid/trainer-single-receiver.yaml');
    // 120 models whose names sort before the Kestrel's: it is the 121st, past any first page.
    const hangar = [
      ...Array.from({ length: 120 }, (_, n) =>
        modelView(modelRecord(`Fleet ${String(n + 1).padStart(3, '0')}`, [yaml])),
      ),
      modelView(kestrel),
    ];
    const server = fakeServer(
      unitRoutes(state, {
        [`GET /api/workspaces/${CLUB}/models`]: ({ url }) => {
          const q = url.searchParams.get('q')?.toLowerCase() ?? '';
          return keysetPage(
            hangar.filter((model) => model.name.toLowerCase().includes(q)),
            url,
          );
        },
      }),
    );
    const { user } = renderApp(`/w/${CLUB}/shelf/${state.unit.id}`);
    await user.click(await screen.findByRole('button', { name: 'Install into a model' }));
    expect(await screen.findByText('The list shows 50 of 121 matches; type more to narrow it.')).toBeInTheDocument();
    expect(screen.queryByRole('option', { name: kestrel.name })).not.toBeInTheDocument();

    await user.type(screen.getByRole('searchbox', { name: 'Find in the hangar' }), 'kestrel');
    await user.selectOptions(screen.getByLabelText('Model'), await screen.findByRole('option', { name: kestrel.name }));
    await waitFor(() => expect(screen.getByRole('option', { name: /^wing · Wing receiver/ })).toBeInTheDocument());
    const asked = server.called('GET', `/api/workspaces/${CLUB}/models`).map((request) => request.url.searchParams);
    expect(asked.at(-1)?.get('q')).toBe('kestrel');
    expect(asked.every((params) => params.get('limit') === '50')).toBe(true);
  });

  it('asks for every change to be ticked before "I have applied these settings", then records them', async () => {
    const state = { unit: installedIn(unitRecord('trainer-unit'), 'wing') };
    const server = fakeServer(
      unitRoutes(state, {
        [`POST /api/receivers/${state.unit.id}/apply`]: () => {
          const target = checkFor(state.unit, kestrel, 'wing').target;
          state.unit = { ...state.unit, stored_settings: target, telemetry: target.telemetry };
          return { body: { data: { ...checkFor(state.unit, kestrel, 'wing'), receiver: state.unit } } };
        },
      }),
    );
    const { user } = renderApp(`/w/${CLUB}/shelf/${state.unit.id}`);
    const list = await screen.findByRole('group', { name: 'Program these on the unit' });
    const boxes = within(list).getAllByRole('checkbox');
    expect(boxes).toHaveLength(13);
    const apply = screen.getByRole('button', { name: 'I have applied these settings' });
    expect(apply).toBeDisabled();
    for (const box of boxes) await user.click(box);
    // Every setting ticked, the re-bind step is still open.
    expect(apply).toBeDisabled();
    await user.click(screen.getByRole('checkbox', { name: /Bind the unit to this model/ }));
    expect(apply).toBeEnabled();

    await user.click(apply);
    await waitFor(() => expect(server.called('POST', `/api/receivers/${state.unit.id}/apply`)).toHaveLength(1));
    expect(server.called('POST', `/api/receivers/${state.unit.id}/apply`)[0].body).toEqual({
      revision: kestrel.revisions[0].id,
    });
    expect(await screen.findByText('Ready: nothing to change on the unit')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'I have applied these settings' })).not.toBeInTheDocument();
  });

  it('lets a reviewer read the check but not tick, apply, install or remove', async () => {
    const state = { unit: { ...installedIn(unitRecord('trainer-unit'), 'wing'), workspace_id: BUILDERS } };
    fakeServer(unitRoutes(state));
    renderApp(`/w/${BUILDERS}/shelf/${state.unit.id}`);
    const list = await screen.findByRole('group', { name: 'What would have to change on the unit' });
    expect(within(list).queryByRole('checkbox')).not.toBeInTheDocument();
    for (const name of [
      'I have applied these settings',
      'Remove',
      'Move to another slot',
      'Edit details',
      'Record what it holds',
    ]) {
      expect(screen.queryByRole('button', { name })).not.toBeInTheDocument();
    }
  });
});
