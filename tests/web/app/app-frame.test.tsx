import { screen, waitFor, within } from '@testing-library/react';
import { BUILDERS, CLUB, apiError, demoUser, demoWorkspaces, fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';

describe('The signed-in app frame', () => {
  it('sends a signed-out visitor to sign-in and back to the page they asked for', async () => {
    const { routes } = sessionRoutes();
    fakeServer({ ...routes, [`GET /api/workspaces/${BUILDERS}/members`]: () => ({ body: { data: [] } }) });
    const { user, location } = renderApp(`/w/${BUILDERS}/team`);

    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in' })).toBeInTheDocument();
    expect(location().pathname).toBe('/sign-in');
    expect(location().search).toBe(`?next=${encodeURIComponent(`/w/${BUILDERS}/team`)}`);

    await user.type(screen.getByLabelText('E-mail'), demoUser.email);
    await user.type(screen.getByLabelText('Password'), 'bindery-demo-1');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Team' })).toBeInTheDocument();
    expect(location().pathname).toBe(`/w/${BUILDERS}/team`);
  });

  it('opens the first workspace’s hangar from the home address', async () => {
    fakeServer(sessionRoutes({ signedIn: true }).routes);
    const { location } = renderApp('/');

    expect(await screen.findByRole('heading', { level: 1, name: 'Hangar' })).toBeInTheDocument();
    expect(location().pathname).toBe(`/w/${CLUB}/hangar`);
    expect(document.title).toBe('Hangar · Bindery');
    const nav = screen.getByRole('navigation', { name: 'Workspace' });
    expect(within(nav).getByRole('link', { name: 'Hangar' })).toHaveAttribute('aria-current', 'page');
    expect(
      within(nav)
        .getAllByRole('link')
        .map((link) => link.textContent),
    ).toEqual(['Hangar', 'Shelf', 'Reviews', 'Team', 'Backups']);
    expect(screen.getByText(demoUser.name)).toBeInTheDocument();
  });

  it('offers the workspaces beyond the session’s first page and adds them to the switcher', async () => {
    const { routes } = sessionRoutes({ signedIn: true });
    const third = { id: '3c1a9e52-7f0b-4e6d-9a21-5b8c0d4e7f63', name: 'Wetland Gliding Group', role: 'viewer' };
    const server = fakeServer({
      ...routes,
      'GET /api/session': () => ({
        body: {
          data: { user: demoUser, workspaces: demoWorkspaces },
          pagination: { limit: 2, offset: 0, total: 3 },
        },
      }),
      'GET /api/me': () => ({
        body: { data: { user: demoUser, workspaces: [third] }, pagination: { limit: 100, offset: 2, total: 3 } },
      }),
    });
    const { user } = renderApp('/');

    await user.click(await screen.findByRole('button', { name: 'More workspaces (2 of 3)' }));
    expect(await screen.findByRole('option', { name: 'Wetland Gliding Group (viewer)' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /More workspaces/ })).not.toBeInTheDocument();
    expect(server.called('GET', '/api/me')[0].url.search).toBe('?limit=100&offset=2');
  });

  it('tells a user who is in no workspace how to join one', async () => {
    fakeServer(sessionRoutes({ signedIn: true, workspaces: [] }).routes);
    renderApp('/');

    expect(await screen.findByRole('heading', { name: 'You are not in a workspace yet' })).toBeInTheDocument();
  });

  it('refuses a workspace the user is not a member of', async () => {
    fakeServer(sessionRoutes({ signedIn: true }).routes);
    renderApp('/w/404/hangar');

    expect(await screen.findByRole('heading', { name: 'Workspace not found' })).toBeInTheDocument();
  });

  it('shows an error with a retry when the session cannot be loaded for another reason', async () => {
    let failing = true;
    const { routes } = sessionRoutes({ signedIn: true });
    fakeServer({
      ...routes,
      'GET /api/session': (request) =>
        failing ? apiError(403, 'account-locked', 'This account is locked.') : routes['GET /api/session'](request),
    });
    const { user } = renderApp(`/w/${CLUB}/hangar`);

    expect(await screen.findByRole('alert')).toHaveTextContent('This account is locked.');
    failing = false;
    await user.click(screen.getByRole('button', { name: 'Try again' }));
    expect(await screen.findByRole('heading', { level: 1, name: 'Hangar' })).toBeInTheDocument();
  });

  it('signs out and returns to sign-in', async () => {
    const { routes, state } = sessionRoutes({ signedIn: true });
    const server = fakeServer(routes);
    const { user, location } = renderApp(`/w/${CLUB}/shelf`);

    await user.click(await screen.findByRole('button', { name: 'Sign out' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in' })).toBeInTheDocument();
    expect(location().pathname).toBe('/sign-in');
    expect(server.called('POST', '/api/auth/sign-out')).toHaveLength(1);
    expect(state.signedIn).toBe(false);
    expect(await screen.findByText('Signed out')).toBeInTheDocument();
  });

  it('returns to sign-in when a screen’s request meets an expired session', async () => {
    const { routes, state } = sessionRoutes({ signedIn: true });
    fakeServer({
      ...routes,
      [`GET /api/workspaces/${CLUB}/members`]: () => {
        state.signedIn = false;
        return apiError(401, 'token-expired', 'Your session has expired.');
      },
    });
    const { location } = renderApp(`/w/${CLUB}/team`);

    await waitFor(() => expect(location().pathname).toBe('/sign-in'));
    expect(location().search).toBe(`?next=${encodeURIComponent(`/w/${CLUB}/team`)}`);
  });

  it('frames a model’s screens with their own navigation', async () => {
    fakeServer(sessionRoutes({ signedIn: true }).routes);
    const { user, location } = renderApp('/models/42');

    expect(await screen.findByRole('heading', { level: 1, name: 'Overview' })).toBeInTheDocument();
    expect(location().pathname).toBe('/models/42/overview');
    const nav = screen.getByRole('navigation', { name: 'Model' });
    expect(
      within(nav)
        .getAllByRole('link')
        .map((link) => link.textContent),
    ).toEqual(['Overview', 'Edit', 'Bench', 'History', 'Compare', 'Reviews', 'Field sheet', 'Settings']);

    await user.click(within(nav).getByRole('link', { name: 'Bench' }));
    expect(await screen.findByRole('heading', { level: 1, name: 'Bench' })).toBeInTheDocument();
    expect(location().pathname).toBe('/models/42/bench');
    expect(document.title).toBe('Bench · Bindery');
  });

  it('answers an unknown address with the not-found page', async () => {
    fakeServer({});
    renderApp('/hangars/everything');

    expect(await screen.findByRole('heading', { level: 1, name: 'Page not found' })).toBeInTheDocument();
    expect(document.title).toBe('Page not found · Bindery');
  });
});
