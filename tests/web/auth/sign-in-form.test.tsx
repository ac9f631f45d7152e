import { screen, waitFor } from '@testing-library/react';
import { CLUB, apiError, demoUser, fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';

describe('Sign in', () => {
  it('shows the server’s message for a field beside that field', async () => {
    const server = fakeServer({
      'POST /api/auth/sign-in': () =>
        apiError(422, 'invalid-input', 'Some fields need attention.', {
          fields: { email: 'That does not look like an e-mail address.' },
        }),
    });
    const { user } = renderApp('/sign-in');

    await user.type(await screen.findByLabelText('E-mail'), 'wren@hollowfield');
    await user.type(screen.getByLabelText('Password'), 'anything-long');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    const email = screen.getByLabelText('E-mail');
    await waitFor(() => expect(email).toHaveAttribute('aria-invalid', 'true'));
    expect(email).toHaveAccessibleDescription('That does not look like an e-mail address.');
    expect(email).toHaveFocus();
    expect(screen.getByLabelText('Password')).not.toHaveAttribute('aria-invalid');
    // The field's own message replaces the generic one; nothing is said twice.
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
    expect(server.called('POST', '/api/auth/sign-in')[0].body).toEqual({
      email: 'wren@hollowfield',
      password: 'anything-long',
    });
  });

  it('says so when the password is wrong and stays on the form', async () => {
    const { routes } = sessionRoutes();
    fakeServer(routes);
    const { user, location } = renderApp('/sign-in');

    await user.type(await screen.findByLabelText('E-mail'), demoUser.email);
    await user.type(screen.getByLabelText('Password'), 'not-the-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('That e-mail and password do not match an account.');
    expect(location().pathname).toBe('/sign-in');
    expect(screen.getByLabelText('E-mail')).toHaveValue(demoUser.email);
  });

  it('asks for both fields before sending anything', async () => {
    const server = fakeServer({});
    const { user } = renderApp('/sign-in');

    await user.click(await screen.findByRole('button', { name: 'Sign in' }));

    expect(screen.getByLabelText('E-mail')).toHaveAccessibleDescription('Enter your e-mail address.');
    expect(screen.getByLabelText('Password')).toHaveAccessibleDescription('Enter your password.');
    expect(server.fetch).not.toHaveBeenCalled();
  });

  it('signs in with the session cookie and opens the first workspace’s hangar', async () => {
    const { routes, state } = sessionRoutes();
    const server = fakeServer(routes);
    const { user, location } = renderApp('/sign-in');

    await user.type(await screen.findByLabelText('E-mail'), `  ${demoUser.email} `);
    await user.type(screen.getByLabelText('Password'), 'bindery-demo-1');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Hangar' })).toBeInTheDocument();
    expect(location().pathname).toBe(`/w/${CLUB}/hangar`);
    expect(state.signedIn).toBe(true);
    const [signIn] = server.called('POST', '/api/auth/sign-in');
    expect(signIn.body).toEqual({ email: demoUser.email, password: 'bindery-demo-1' });
    expect(signIn.credentials).toBe('same-origin');
    expect(signIn.headers.get('Content-Type')).toBe('application/json');
  });

  it('shows the rate limit’s message when sign-in is refused for too many attempts', async () => {
    fakeServer({
      'POST /api/auth/sign-in': () =>
        apiError(429, 'rate-limited', 'Too many sign-in attempts. Try again in 15 minutes.'),
    });
    const { user } = renderApp('/sign-in');

    await user.type(await screen.findByLabelText('E-mail'), demoUser.email);
    await user.type(screen.getByLabelText('Password'), 'bindery-demo-1');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('Too many sign-in attempts. Try again in 15 minutes.');
  });
});
