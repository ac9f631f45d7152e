import { screen, waitFor } from '@testing-library/react';
import { CLUB, apiError, demoUser, fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';

describe('Create account', () => {
  it('checks name, e-mail and password length before sending anything', async () => {
    const server = fakeServer({});
    const { user } = renderApp('/create-account');

    await user.type(await screen.findByLabelText('E-mail'), 'wren-at-hollowfield');
    await user.type(screen.getByLabelText('Password'), 'short-pw1');
    await user.click(screen.getByRole('button', { name: 'Create account' }));

    const name = screen.getByLabelText('Name');
    expect(name).toHaveAttribute('aria-invalid', 'true');
    expect(name).toHaveAccessibleDescription('Enter the name your club mates know you by.');
    expect(name).toHaveFocus();
    expect(screen.getByLabelText('E-mail')).toHaveAccessibleDescription(
      'Enter an e-mail address like name@example.org.',
    );
    // Nine characters: one short of the minimum of ten.
    expect(screen.getByLabelText('Password')).toHaveAccessibleDescription(
      'At least 10 characters. Use at least 10 characters.',
    );
    expect(server.fetch).not.toHaveBeenCalled();
  });

  it('accepts a ten-character password and shows the server’s answer for a taken address', async () => {
    const server = fakeServer({
      'POST /api/auth/sign-up': () =>
        apiError(409, 'email-taken', 'An account already uses that address.', {
          fields: { email: 'An account already uses that address.' },
        }),
    });
    const { user, location } = renderApp('/create-account');

    await user.type(await screen.findByLabelText('Name'), 'Wren Calloway');
    await user.type(screen.getByLabelText('E-mail'), demoUser.email);
    await user.type(screen.getByLabelText('Password'), 'ten-chars!');
    await user.click(screen.getByRole('button', { name: 'Create account' }));

    const email = screen.getByLabelText('E-mail');
    await waitFor(() => expect(email).toHaveAccessibleDescription('An account already uses that address.'));
    expect(screen.getByLabelText('Password')).not.toHaveAttribute('aria-invalid');
    expect(server.called('POST', '/api/auth/sign-up')[0].body).toEqual({
      email: demoUser.email,
      name: 'Wren Calloway',
      password: 'ten-chars!',
    });
    expect(location().pathname).toBe('/create-account');
  });

  it('puts a server message about a field the form lacks at the top of the form', async () => {
    fakeServer({
      'POST /api/auth/sign-up': () =>
        apiError(422, 'invalid-input', 'Some fields need attention.', {
          fields: { invitation: 'This invitation has expired.' },
        }),
    });
    const { user } = renderApp('/create-account');

    await user.type(await screen.findByLabelText('Name'), 'Wren Calloway');
    await user.type(screen.getByLabelText('E-mail'), demoUser.email);
    await user.type(screen.getByLabelText('Password'), 'a-long-password');
    await user.click(screen.getByRole('button', { name: 'Create account' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('This invitation has expired.');
  });

  it('signs the new account in and opens its first workspace', async () => {
    const { routes, state } = sessionRoutes();
    fakeServer({
      ...routes,
      'POST /api/auth/sign-up': () => {
        state.signedIn = true;
        return { status: 201, body: { data: { user: demoUser, token: 'header.payload.signature' } } };
      },
    });
    const { user, location } = renderApp('/create-account');

    await user.type(await screen.findByLabelText('Name'), demoUser.name);
    await user.type(screen.getByLabelText('E-mail'), demoUser.email);
    await user.type(screen.getByLabelText('Password'), 'a-long-password');
    await user.click(screen.getByRole('button', { name: 'Create account' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Hangar' })).toBeInTheDocument();
    expect(location().pathname).toBe(`/w/${CLUB}/hangar`);
  });
});
