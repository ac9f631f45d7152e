import { screen } from '@testing-library/react';
import { fakeServer } from '../fake-server';
import { renderApp } from '../render-app';

describe('Reset password request', () => {
  it('posts the address and shows the server’s answer', async () => {
    const server = fakeServer({
      'POST /api/auth/password-reset': () => ({
        status: 202,
        body: { data: { message: 'If that address has an account, a reset link is on its way.' } },
      }),
    });
    const { user } = renderApp('/reset-password');

    await user.type(await screen.findByLabelText('E-mail'), 'wren@hollowfield.example');
    await user.click(screen.getByRole('button', { name: 'Send reset link' }));

    expect(await screen.findByRole('status')).toHaveTextContent(
      'If that address has an account, a reset link is on its way.',
    );
    expect(server.called('POST', '/api/auth/password-reset')[0].body).toEqual({ email: 'wren@hollowfield.example' });
  });

  it('shows the server’s error when the request is refused', async () => {
    fakeServer({});
    const { user } = renderApp('/reset-password');

    await user.type(await screen.findByLabelText('E-mail'), 'wren@hollowfield.example');
    await user.click(screen.getByRole('button', { name: 'Send reset link' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('No route POST /api/auth/password-reset');
  });
});
