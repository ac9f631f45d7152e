import { screen, within } from '@testing-library/react';
import { CLUB, apiError, demoUser, fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';
import { DEFAULT_CLUB_RULES } from '@shared/rules/club-rules';

// An owner's Team screen also reads the pending invitations, the activity and the club rules.
const ownerExtras = {
  [`GET /api/workspaces/${CLUB}/invitations`]: () => ({ body: { data: [] } }),
  [`GET /api/workspaces/${CLUB}/rules`]: () => ({
    body: {
      data: {
        ...DEFAULT_CLUB_RULES,
        defaults: { 'failsafe-unset': 'warning', 'failsafe-throttle': 'error' },
        updated_at: null,
        history: [],
      },
    },
  }),
  [`GET /api/workspaces/${CLUB}/audit`]: () => ({ body: { data: [], pagination: { total: 0 } } }),
};

const members = [
  { user: demoUser, role: 'owner' },
  {
    user: { id: 'e8a91f3c-27d6-4b0e-a5c4-6d13f2b7a902', email: 'juno@hollowfield.example', name: 'Juno Marsh' },
    role: 'reviewer',
  },
];

describe('Team', () => {
  it('lists the workspace’s members with their roles', async () => {
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...ownerExtras,
      [`GET /api/workspaces/${CLUB}/members`]: () => ({ body: { data: members, pagination: { total: 2 } } }),
    });
    renderApp(`/w/${CLUB}/team`);

    const table = await screen.findByRole('table', { name: 'Members of this workspace' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(
      rows.map((row) =>
        within(row)
          .getAllByRole('cell')
          .slice(0, 2)
          .map((cell) => cell.textContent),
      ),
    ).toEqual([
      ['Wren Calloway(you)', 'wren@hollowfield.example'],
      ['Juno Marsh', 'juno@hollowfield.example'],
    ]);
    expect(within(rows[0]).getByRole('combobox', { name: 'Role of Wren Calloway' })).toHaveValue('owner');
    expect(within(rows[1]).getByRole('combobox', { name: 'Role of Juno Marsh' })).toHaveValue('reviewer');
    expect(server.called('GET', `/api/workspaces/${CLUB}/members`)[0].credentials).toBe('same-origin');
    expect(document.title).toBe('Team · Hollowfield Aero Club · Bindery');
  });

  it('says when the workspace has no members to show', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...ownerExtras,
      [`GET /api/workspaces/${CLUB}/members`]: () => ({ body: { data: [] } }),
    });
    renderApp(`/w/${CLUB}/team`);

    expect(await screen.findByRole('heading', { name: 'No members yet' })).toBeInTheDocument();
  });

  it('shows the server’s error when the list cannot be loaded', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...ownerExtras,
      [`GET /api/workspaces/${CLUB}/members`]: () =>
        apiError(403, 'forbidden', 'Your role in this workspace does not allow that.'),
    });
    renderApp(`/w/${CLUB}/team`);

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('The member list could not be loaded');
    expect(alert).toHaveTextContent('Your role in this workspace does not allow that.');
  });

  it('shows a loading state while the list is on its way', async () => {
    let answer: (value: { body: unknown }) => void = () => {};
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...ownerExtras,
      [`GET /api/workspaces/${CLUB}/members`]: () => new Promise((resolve) => (answer = resolve)),
    });
    renderApp(`/w/${CLUB}/team`);

    expect(await screen.findByText('Loading members…')).toBeInTheDocument();
    answer({ body: { data: members } });
    expect(await screen.findByText('Juno Marsh')).toBeInTheDocument();
    expect(screen.queryByText('Loading members…')).not.toBeInTheDocument();
  });
});
