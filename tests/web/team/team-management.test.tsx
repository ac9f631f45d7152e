import { screen, waitFor, within } from '@testing-library/react';
import { BUILDERS, CLUB, apiError, demoUser, fakeServer, sessionRoutes, type FakeHandler } from '../fake-server';
import { renderApp } from '../render-app';

const juno = { id: 'e8a91f3c-27d6-4b0e-a5c4-6d13f2b7a902', email: 'juno@hollowfield.example', name: 'Juno Marsh' };

function teamRoutes(overrides: Record<string, FakeHandler> = {}) {
  const state = {
    members: [
      { user: demoUser, role: 'owner' },
      { user: juno, role: 'reviewer' },
    ],
    invitations: [] as unknown[],
  };
  const routes: Record<string, FakeHandler> = {
    ...sessionRoutes({ signedIn: true }).routes,
    [`GET /api/workspaces/${CLUB}/members`]: () => ({ body: { data: state.members } }),
    [`GET /api/workspaces/${CLUB}/invitations`]: () => ({ body: { data: state.invitations } }),
    [`GET /api/workspaces/${CLUB}/audit`]: () => ({
      body: {
        data: [
          {
            id: 'a1',
            action: 'member.invited',
            actor: { id: demoUser.id, name: 'Wren Calloway' },
            subject: { type: 'invitation', id: 'i1' },
            details: { email: 'pip@example.org', role: 'editor' },
            created_at: new Date().toISOString(),
          },
        ],
        pagination: { total: 1 },
      },
    }),
    ...overrides,
  };
  return { state, routes };
}

describe('Team, as an owner', () => {
  it('invites by e-mail with a role and lists the invitation as pending', async () => {
    const { state, routes } = teamRoutes();
    const server = fakeServer({
      ...routes,
      [`POST /api/workspaces/${CLUB}/invitations`]: (request) => {
        const body = request.body as { email: string; role: string };
        const invitation = {
          id: 'inv-1',
          workspace_id: CLUB,
          email: body.email,
          role: body.role,
          status: 'pending',
          invited_by: { id: demoUser.id, name: 'Wren Calloway' },
          expires_at: new Date(Date.now() + 6 * 86_400_000).toISOString(),
          accepted_at: null,
          revoked_at: null,
          created_at: new Date().toISOString(),
        };
        state.invitations = [invitation];
        return { status: 201, body: { data: invitation } };
      },
    });
    const { user } = renderApp(`/w/${CLUB}/team`);

    const form = await screen.findByRole('form', { name: 'Invite a member' });
    await user.type(within(form).getByLabelText('E-mail'), 'pip@example.org');
    await user.selectOptions(within(form).getByLabelText('Role'), 'editor');
    await user.click(within(form).getByRole('button', { name: 'Send invitation' }));

    expect(await within(form).findByRole('status')).toHaveTextContent('An invitation is on its way to pip@example.org');
    expect(server.called('POST', `/api/workspaces/${CLUB}/invitations`)[0].body).toEqual({
      email: 'pip@example.org',
      role: 'editor',
    });
    const pending = await screen.findByRole('list', { name: 'Pending invitations' });
    expect(await within(pending).findByText('pip@example.org')).toBeInTheDocument();
    expect(within(pending).getByText('Editor')).toBeInTheDocument();
    expect(screen.getByRole('list', { name: 'Activity in this workspace' })).toHaveTextContent(
      'Wren Calloway invited pip@example.org as an editor',
    );
  });

  it('shows the server’s reason beside the field when an invitation is refused', async () => {
    const { routes } = teamRoutes();
    fakeServer({
      ...routes,
      [`POST /api/workspaces/${CLUB}/invitations`]: () =>
        apiError(409, 'already-member', 'juno@hollowfield.example is already a member.', {
          fields: { email: 'This address already belongs to a member of this workspace.' },
        }),
    });
    const { user } = renderApp(`/w/${CLUB}/team`);
    const form = await screen.findByRole('form', { name: 'Invite a member' });
    await user.type(within(form).getByLabelText('E-mail'), 'juno@hollowfield.example');
    await user.click(within(form).getByRole('button', { name: 'Send invitation' }));
    expect(
      await within(form).findByText('This address already belongs to a member of this workspace.'),
    ).toBeInTheDocument();
    expect(within(form).getByLabelText('E-mail')).toHaveAttribute('aria-invalid', 'true');
  });

  it('changes a member’s role, and tells why the last owner cannot be demoted', async () => {
    const { state, routes } = teamRoutes();
    const server = fakeServer({
      ...routes,
      [`PATCH /api/workspaces/${CLUB}/members/${juno.id}`]: (request) => {
        state.members = state.members.map((member) =>
          member.user.id === juno.id ? { ...member, role: (request.body as { role: string }).role } : member,
        );
        return { body: { data: state.members[1] } };
      },
      [`PATCH /api/workspaces/${CLUB}/members/${demoUser.id}`]: () =>
        apiError(
          409,
          'last-owner',
          'A workspace needs an owner: making Wren Calloway an editor would leave it without one.',
        ),
    });
    const { user } = renderApp(`/w/${CLUB}/team`);

    await user.selectOptions(await screen.findByRole('combobox', { name: 'Role of Juno Marsh' }), 'editor');
    expect(await screen.findByText('Juno Marsh is now an editor')).toBeInTheDocument();
    expect(server.called('PATCH', `/api/workspaces/${CLUB}/members/${juno.id}`)[0].body).toEqual({ role: 'editor' });
    await waitFor(() => expect(screen.getByRole('combobox', { name: 'Role of Juno Marsh' })).toHaveValue('editor'));

    await user.selectOptions(screen.getByRole('combobox', { name: 'Role of Wren Calloway' }), 'editor');
    expect(await screen.findByText(/would leave it without one/)).toBeInTheDocument();
    expect(screen.getByRole('combobox', { name: 'Role of Wren Calloway' })).toHaveValue('owner');
  });

  it('removes a member after asking', async () => {
    const { state, routes } = teamRoutes();
    const server = fakeServer({
      ...routes,
      [`DELETE /api/workspaces/${CLUB}/members/${juno.id}`]: () => {
        state.members = state.members.filter((member) => member.user.id !== juno.id);
        return { body: { data: { removed: true, left: false } } };
      },
    });
    const { user } = renderApp(`/w/${CLUB}/team`);
    await user.click(await screen.findByRole('button', { name: 'Remove Juno Marsh' }));
    const dialog = screen.getByRole('dialog', { name: 'Remove Juno Marsh?' });
    await user.click(within(dialog).getByRole('button', { name: 'Remove from the workspace' }));
    await waitFor(() => expect(screen.queryByRole('cell', { name: 'Juno Marsh' })).not.toBeInTheDocument());
    expect(server.called('DELETE', `/api/workspaces/${CLUB}/members/${juno.id}`)).toHaveLength(1);
  });

  it('shows how many invitations wait and fetches the next page when asked', async () => {
    const pending = Array.from({ length: 3 }, (_, index) => ({
      id: `inv-${index}`,
      email: `pilot${index}@example.org`,
      role: 'viewer',
      status: 'pending',
      invited_by: { id: demoUser.id, name: demoUser.name },
      created_at: new Date().toISOString(),
      expires_at: new Date(Date.now() + 86_400_000).toISOString(),
    }));
    const { routes } = teamRoutes({
      [`GET /api/workspaces/${CLUB}/invitations`]: ({ url }) => {
        const offset = Number(url.searchParams.get('offset'));
        // The server's page holds two here, so the third is on a page of its own.
        return { body: { data: pending.slice(offset, offset + 2), pagination: { limit: 50, offset, total: 3 } } };
      },
    });
    fakeServer(routes);
    const { user } = renderApp(`/w/${CLUB}/team`);

    const list = await screen.findByRole('list', { name: 'Pending invitations' });
    expect(within(list).getAllByRole('listitem')).toHaveLength(2);
    expect(screen.getByText('3 waiting')).toBeInTheDocument();
    expect(screen.getByText('Showing 2 of 3 invitations.')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Show more' }));
    expect(await screen.findByText('pilot2@example.org')).toBeInTheDocument();
    expect(screen.queryByText('Showing 2 of 3 invitations.')).not.toBeInTheDocument();
  });
});

describe('Team activity', () => {
  it('names the model of each save and pages twenty events at a time, older ones on asking', async () => {
    const kestrel = { id: 'b7e2c4a1-0d3f-4e58-9a61-c2f4e8d0a513', name: 'Kestrel Mk II' };
    // 45 saves, newest first: revision 45 down to revision 1.
    const trail = Array.from({ length: 45 }, (_, index) => ({
      id: `e${45 - index}`,
      action: 'revision.saved',
      actor: { id: demoUser.id, name: 'Wren Calloway' },
      subject: { type: 'revision', id: `r${45 - index}` },
      model: kestrel,
      details: { model_id: kestrel.id, number: 45 - index },
      created_at: new Date(Date.now() - index * 60_000).toISOString(),
    }));
    const { routes } = teamRoutes({
      [`GET /api/workspaces/${CLUB}/audit`]: (request) => {
        const limit = Number(request.url.searchParams.get('limit'));
        const offset = Number(request.url.searchParams.get('offset'));
        return {
          body: { data: trail.slice(offset, offset + limit), pagination: { limit, offset, total: trail.length } },
        };
      },
    });
    const server = fakeServer(routes);
    const { user } = renderApp(`/w/${CLUB}/team`);

    const list = await screen.findByRole('list', { name: 'Activity in this workspace' });
    const items = () => within(list).getAllByRole('listitem');
    expect(items()).toHaveLength(20);
    expect(items()[0]).toHaveTextContent('Kestrel Mk II: Wren Calloway saved revision 45');
    expect(screen.getByText('The newest 20 of 45 events.')).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Show older activity' }));
    await waitFor(() => expect(items()).toHaveLength(40));
    await user.click(screen.getByRole('button', { name: 'Show older activity' }));
    await waitFor(() => expect(items()).toHaveLength(45));
    expect(items()[44]).toHaveTextContent('Kestrel Mk II: Wren Calloway saved revision 1');
    expect(screen.queryByRole('button', { name: 'Show older activity' })).not.toBeInTheDocument();
    const offsets = server
      .called('GET', `/api/workspaces/${CLUB}/audit`)
      .map((request) => request.url.searchParams.get('offset'));
    expect([...new Set(offsets)]).toEqual(['0', '20', '40']);
  });
});

describe('Team, as a reviewer', () => {
  it('shows roles as words, no invite form and no activity, and offers to leave', async () => {
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      [`GET /api/workspaces/${BUILDERS}/members`]: () => ({
        body: {
          data: [
            { user: demoUser, role: 'reviewer' },
            { user: juno, role: 'owner' },
          ],
        },
      }),
    });
    renderApp(`/w/${BUILDERS}/team`);
    const table = await screen.findByRole('table', { name: 'Members of this workspace' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(
      rows.map((row) =>
        within(row)
          .getAllByRole('cell')
          .map((cell) => cell.textContent),
      ),
    ).toEqual([
      ['Wren Calloway(you)', 'wren@hollowfield.example', 'Reviewer', 'Leave'],
      ['Juno Marsh', 'juno@hollowfield.example', 'Owner', ''],
    ]);
    expect(screen.queryByRole('form', { name: 'Invite a member' })).not.toBeInTheDocument();
    expect(screen.queryByText('Activity')).not.toBeInTheDocument();
    expect(server.called('GET', `/api/workspaces/${BUILDERS}/invitations`)).toHaveLength(0);
    expect(server.called('GET', `/api/workspaces/${BUILDERS}/audit`)).toHaveLength(0);
  });
});
