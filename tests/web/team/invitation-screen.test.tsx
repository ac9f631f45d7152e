import { screen } from '@testing-library/react';
import { CLUB, apiError, demoUser, demoWorkspaces, fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';

const TOKEN = 'header.payload.signature';
const preview = (fields: Record<string, unknown> = {}) => ({
  workspace: { id: CLUB, name: 'Hollowfield Aero Club' },
  role: 'reviewer',
  email: 'newcomer@hollowfield.example',
  invited_by: { id: 'o', name: 'Olive Hatch' },
  expires_at: new Date(Date.now() + 86_400_000).toISOString(),
  account_exists: false,
  ...fields,
});

describe('the invitation page', () => {
  it('creates the invited account and joins the workspace', async () => {
    const session = sessionRoutes({ signedIn: false });
    const server = fakeServer({
      ...session.routes,
      [`GET /api/invitations/${TOKEN}`]: () => ({ body: { data: preview() } }),
      [`POST /api/invitations/${TOKEN}/accept`]: () => {
        session.state.signedIn = true;
        return {
          status: 201,
          body: {
            data: {
              user: demoUser,
              token: 't',
              workspace: { id: CLUB, name: 'Hollowfield Aero Club', role: 'reviewer' },
            },
          },
        };
      },
      [`GET /api/workspaces/${CLUB}/models`]: () => ({ body: { data: [], pagination: { total: 0 } } }),
    });
    const { user, location } = renderApp(`/invitations/${TOKEN}`);

    expect(await screen.findByRole('heading', { name: 'Join Hollowfield Aero Club' })).toBeInTheDocument();
    expect(screen.getByText('Olive Hatch invites you to this workspace as a reviewer.')).toBeInTheDocument();
    expect(screen.getByText('newcomer@hollowfield.example')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));
    expect(await screen.findByText('Enter the name your club mates know you by.')).toBeInTheDocument();

    await user.type(screen.getByLabelText('Name'), 'Nell Whitethroat');
    await user.type(screen.getByLabelText('Password'), 'thermal-bubble-77');
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));
    await vi.waitFor(() => expect(location().pathname).toBe(`/w/${CLUB}/hangar`));
    expect(server.called('POST', `/api/invitations/${TOKEN}/accept`)[0].body).toEqual({
      name: 'Nell Whitethroat',
      password: 'thermal-bubble-77',
    });
  });

  it('lets a signed-in user accept with one button and opens the workspace', async () => {
    let joined = false;
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      'GET /api/session': () => ({
        body: { data: { user: demoUser, workspaces: joined ? demoWorkspaces : demoWorkspaces.slice(1) } },
      }),
      [`GET /api/invitations/${TOKEN}`]: () => ({
        body: { data: preview({ email: demoUser.email, account_exists: true }) },
      }),
      [`POST /api/invitations/${TOKEN}/accept`]: () => {
        joined = true;
        return {
          body: { data: { user: demoUser, workspace: { id: CLUB, name: 'Hollowfield Aero Club', role: 'reviewer' } } },
        };
      },
      [`GET /api/workspaces/${CLUB}/models`]: () => ({ body: { data: [], pagination: { total: 0 } } }),
    });
    const { user, location } = renderApp(`/invitations/${TOKEN}`);
    expect(await screen.findByText(/You are signed in as/)).toHaveTextContent('Wren Calloway');
    await user.click(screen.getByRole('button', { name: 'Accept and join Hollowfield Aero Club' }));
    await vi.waitFor(() => expect(location().pathname).toBe(`/w/${CLUB}/hangar`));
    expect(server.called('POST', `/api/invitations/${TOKEN}/accept`)[0].body).toEqual({});
    expect(screen.queryByText(/already a member/)).not.toBeInTheDocument();
  });

  it('tells an account under another address that the invitation is not theirs, and lets them switch', async () => {
    const session = sessionRoutes({ signedIn: true, workspaces: demoWorkspaces.slice(1) });
    const server = fakeServer({
      ...session.routes,
      [`GET /api/invitations/${TOKEN}`]: () => ({ body: { data: preview({ account_exists: true }) } }),
    });
    const { user, location } = renderApp(`/invitations/${TOKEN}`);
    expect(await screen.findByRole('alert')).toHaveTextContent(
      `This invitation is for newcomer@hollowfield.example, and you are signed in as ${demoUser.email}.`,
    );
    expect(screen.queryByRole('button', { name: /Accept and join/ })).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Sign out and switch account' }));
    expect(await screen.findByRole('link', { name: 'Sign in to accept' })).toBeInTheDocument();
    expect(location().pathname).toBe(`/invitations/${TOKEN}`);
    expect(server.called('POST', '/api/auth/sign-out')).toHaveLength(1);
    expect(server.called('POST', `/api/invitations/${TOKEN}/accept`)).toHaveLength(0);
  });

  it('sends someone with an account to sign in first', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: false }).routes,
      [`GET /api/invitations/${TOKEN}`]: () => ({ body: { data: preview({ account_exists: true }) } }),
    });
    renderApp(`/invitations/${TOKEN}`);
    const link = await screen.findByRole('link', { name: 'Sign in to accept' });
    expect(link).toHaveAttribute('href', `/sign-in?next=${encodeURIComponent(`/invitations/${TOKEN}`)}`);
  });

  it('says why a used or expired link cannot be used', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: false }).routes,
      [`GET /api/invitations/${TOKEN}`]: () =>
        apiError(410, 'token-used', 'This invitation link has already been used; each one works once.'),
    });
    renderApp(`/invitations/${TOKEN}`);
    expect(await screen.findByRole('heading', { name: 'This invitation cannot be used' })).toBeInTheDocument();
    expect(screen.getByRole('alert')).toHaveTextContent('already been used');
  });
});
