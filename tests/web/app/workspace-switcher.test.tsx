import { screen, within } from '@testing-library/react';
import { BUILDERS, CLUB, fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';

describe('Workspace switcher', () => {
  it('lists the user’s workspaces with their role and marks the one in the address', async () => {
    fakeServer(sessionRoutes({ signedIn: true }).routes);
    renderApp(`/w/${BUILDERS}/reviews`);

    const switcher = await screen.findByRole('combobox', { name: 'Workspace' });
    expect(
      within(switcher)
        .getAllByRole('option')
        .map((option) => option.textContent),
    ).toEqual(['Hollowfield Aero Club (owner)', 'Tuesday Night Builders (reviewer)']);
    expect(switcher).toHaveValue(BUILDERS);
  });

  it('moves to the same screen of the chosen workspace', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      [`GET /api/workspaces/${CLUB}/members`]: () => ({ body: { data: [] } }),
      [`GET /api/workspaces/${BUILDERS}/members`]: () => ({ body: { data: [] } }),
    });
    const { user, location } = renderApp(`/w/${CLUB}/team`);

    await user.selectOptions(
      await screen.findByRole('combobox', { name: 'Workspace' }),
      'Tuesday Night Builders (reviewer)',
    );

    expect(location().pathname).toBe(`/w/${BUILDERS}/team`);
    expect(await screen.findByRole('heading', { level: 1, name: 'Team' })).toBeInTheDocument();
    const nav = screen.getByRole('navigation', { name: 'Workspace' });
    expect(within(nav).getByRole('link', { name: 'Hangar' })).toHaveAttribute('href', `/w/${BUILDERS}/hangar`);
  });

  it('keeps the last workspace visited for screens outside a workspace', async () => {
    fakeServer(sessionRoutes({ signedIn: true }).routes);
    const { user, location } = renderApp(`/w/${BUILDERS}/hangar`);
    await screen.findByRole('heading', { level: 1, name: 'Hangar' });

    await user.click(screen.getByRole('link', { name: 'Outbox' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Outbox' })).toBeInTheDocument();
    expect(location().pathname).toBe('/outbox');
    expect(screen.getByRole('combobox', { name: 'Workspace' })).toHaveValue(BUILDERS);
  });
});
