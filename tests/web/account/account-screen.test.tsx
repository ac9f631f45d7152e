import { screen } from '@testing-library/react';
import { apiError, demoUser, fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';

const CURRENT = 'bindery-demo-1';
const NEXT = 'crosswind-final-2207';

describe('the account screen', () => {
  it('is reached from the user name in the frame and changes the password', async () => {
    const session = sessionRoutes({ signedIn: true });
    const server = fakeServer({
      ...session.routes,
      'POST /api/auth/password': () => ({ body: { data: { user: demoUser, token: 't' } } }),
    });
    const { user, location } = renderApp('/');
    await user.click(await screen.findByRole('link', { name: new RegExp(demoUser.name) }));
    expect(await screen.findByRole('heading', { level: 1, name: 'Account' })).toBeInTheDocument();
    expect(location().pathname).toBe('/account');

    await user.type(screen.getByLabelText('Current password'), CURRENT);
    await user.type(screen.getByLabelText('New password'), NEXT);
    await user.type(screen.getByLabelText('The new password again'), `${NEXT}x`);
    await user.click(screen.getByRole('button', { name: 'Change the password' }));
    expect(await screen.findByText('The two passwords differ. Type the same one twice.')).toBeInTheDocument();
    expect(server.called('POST', '/api/auth/password')).toHaveLength(0);

    await user.clear(screen.getByLabelText('The new password again'));
    await user.type(screen.getByLabelText('The new password again'), NEXT);
    await user.click(screen.getByRole('button', { name: 'Change the password' }));
    expect(await screen.findByText('Password changed')).toBeInTheDocument();
    expect(server.called('POST', '/api/auth/password')[0].body).toEqual({ current: CURRENT, password: NEXT });
    expect(screen.getByLabelText('Current password')).toHaveValue('');
  });

  it('shows a wrong current password beside its field', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      'POST /api/auth/password': () =>
        apiError(403, 'wrong-password', 'The current password is not right, so the password was not changed.', {
          fields: { current: 'This is not your current password.' },
        }),
    });
    const { user } = renderApp('/account');
    await user.type(await screen.findByLabelText('Current password'), 'guess-guess-guess');
    await user.type(screen.getByLabelText('New password'), NEXT);
    await user.type(screen.getByLabelText('The new password again'), NEXT);
    await user.click(screen.getByRole('button', { name: 'Change the password' }));
    expect(await screen.findByText('This is not your current password.')).toBeInTheDocument();
    expect(screen.getByLabelText('Current password')).toHaveAttribute('aria-invalid', 'true');
  });

  it('signs out everywhere and leaves for the sign-in page', async () => {
    const session = sessionRoutes({ signedIn: true });
    const server = fakeServer({
      ...session.routes,
      'POST /api/auth/sign-out-everywhere': () => {
        session.state.signedIn = false;
        return { body: { data: { signed_out: true } } };
      },
    });
    const { user, location } = renderApp('/account');
    await user.click(await screen.findByRole('button', { name: 'Sign out everywhere' }));
    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in' })).toBeInTheDocument();
    expect(location().pathname).toBe('/sign-in');
    expect(server.called('POST', '/api/auth/sign-out-everywhere')).toHaveLength(1);
  });
});
