import { screen } from '@testing-library/react';
import { CLUB, apiError, fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';

const TOKEN = 'reset.token.value';

describe('choosing a new password from a reset link', () => {
  it('checks the link, asks for the password twice, sets it and signs in', async () => {
    const session = sessionRoutes({ signedIn: false });
    const server = fakeServer({
      ...session.routes,
      [`GET /api/auth/password-reset/${TOKEN}`]: () => ({ body: { data: { email: 'wren@hollowfield.example' } } }),
      [`POST /api/auth/password-reset/${TOKEN}`]: () => {
        session.state.signedIn = true;
        return { body: { data: { user: {}, token: 't' } } };
      },
      [`GET /api/workspaces/${CLUB}/models`]: () => ({ body: { data: [], pagination: { total: 0 } } }),
    });
    const { user, location } = renderApp(`/reset-password/${TOKEN}`);

    expect(await screen.findByText('wren@hollowfield.example')).toBeInTheDocument();
    await user.type(screen.getByLabelText('New password'), 'crosswind-landing-12');
    await user.type(screen.getByLabelText('The new password again'), 'crosswind-landing-13');
    await user.click(screen.getByRole('button', { name: 'Set the new password' }));
    expect(await screen.findByText('The two passwords differ. Type the same one twice.')).toBeInTheDocument();
    expect(server.called('POST', `/api/auth/password-reset/${TOKEN}`)).toHaveLength(0);

    await user.clear(screen.getByLabelText('The new password again'));
    await user.type(screen.getByLabelText('The new password again'), 'crosswind-landing-12');
    await user.click(screen.getByRole('button', { name: 'Set the new password' }));
    await vi.waitFor(() => expect(location().pathname).toBe(`/w/${CLUB}/hangar`));
    expect(server.called('POST', `/api/auth/password-reset/${TOKEN}`)[0].body).toEqual({
      password: 'crosswind-landing-12',
    });
  });

  it('says when the link has expired and offers a new one', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: false }).routes,
      [`GET /api/auth/password-reset/${TOKEN}`]: () =>
        apiError(401, 'token-expired', 'This password reset link has expired. Ask for a new one.'),
    });
    renderApp(`/reset-password/${TOKEN}`);
    expect(await screen.findByRole('alert')).toHaveTextContent('has expired');
    expect(screen.getByRole('link', { name: 'Ask for a new link' })).toHaveAttribute('href', '/reset-password');
  });
});
