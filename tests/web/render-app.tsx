import { render } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { AppProvider } from '@web/app/provider';
import { routes } from '@web/app/routes';
import { createQueryClient } from '@web/lib/query-client';

/** The whole client (the real route table and providers) at one address, in memory. */
export function renderApp(path: string) {
  const router = createMemoryRouter(routes, { initialEntries: [path] });
  const user = userEvent.setup();
  render(
    <AppProvider queryClient={createQueryClient()}>
      <RouterProvider router={router} />
    </AppProvider>,
  );
  return { router, user, location: () => router.state.location };
}
