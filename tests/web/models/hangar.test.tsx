import { act, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { BUILDERS, CLUB, fakeServer, keysetPage, sessionRoutes, type FakeHandler } from '../fake-server';
import { analyzeSetup } from '@shared/analyze';
import { renderApp } from '../render-app';
import { fixtureText, modelRecord, modelRoutes, modelView, type ModelRecord } from './model-data';

// Three models of the club's hangar, each from a fixture setup so the counts are the
// checks' own: a clean trainer, a sport model with a shared channel, a 16-channel scale model.
function hangarModels(): ModelRecord[] {
  return [
    modelRecord('Wren Trainer', [fixtureText('valid/trainer-single-receiver.yaml')], {
      airframe: 'airplane',
      review_state: 'approved',
    }),
    modelRecord(
      'Meadowlark 40',
      [fixtureText('valid/trainer-single-receiver.yaml'), fixtureText('invalid/channel-shared.yaml')],
      {
        airframe: 'airplane',
        review_state: 'pending',
      },
    ),
    modelRecord(
      'Albatross Scale',
      [1, 2, 3].map(() => fixtureText('valid/scale-16-channel-two-receivers.yaml')),
      { airframe: 'glider' },
    ),
  ];
}

// The hangar as the API answers it: searched on the server (here by name or airframe), by name, a page at a time.
function hangarRoute(models: ModelRecord[], workspace = CLUB): Record<string, FakeHandler> {
  return {
    [`GET /api/workspaces/${workspace}/models`]: ({ url }) => {
      const q = url.searchParams.get('q')?.toLowerCase() ?? '';
      const matching = models
        .filter((model) => `${model.name}\n${model.airframe ?? ''}`.toLowerCase().includes(q))
        .sort((a, b) => a.name.toLowerCase().localeCompare(b.name.toLowerCase()));
      return keysetPage(matching.map(modelView), url);
    },
  };
}

const modelNames = () =>
  within(screen.getByRole('table'))
    .getAllByRole('row')
    .slice(1)
    .map((row) => within(row).getAllByRole('link')[0].textContent);

describe('Hangar', () => {
  it('lists the models sorted by name, with their revision, checks and review state', async () => {
    const models = hangarModels();
    fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...hangarRoute(models) });
    renderApp(`/w/${CLUB}/hangar`);

    await screen.findByRole('table');
    expect(modelNames()).toEqual(['Albatross Scale', 'Meadowlark 40', 'Wren Trainer']);
    const meadowlark = screen.getByRole('row', { name: /Meadowlark 40/ });
    expect(within(meadowlark).getByText('r2')).toBeInTheDocument();
    expect(
      within(meadowlark).getByText(
        `${models[1].revisions[1].error_count} error${models[1].revisions[1].error_count === 1 ? '' : 's'}`,
      ),
    ).toBeInTheDocument();
    expect(within(meadowlark).getByText('Review pending')).toBeInTheDocument();
    expect(within(screen.getByRole('row', { name: /Wren Trainer/ })).getByText('Approved')).toBeInTheDocument();
    expect(within(meadowlark).getByRole('link', { name: 'Meadowlark 40' })).toHaveAttribute(
      'href',
      `/models/${models[1].id}/overview`,
    );
  });

  it('sorts by a column heading, and the other way on a second click', async () => {
    fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...hangarRoute(hangarModels()) });
    const { user, location } = renderApp(`/w/${CLUB}/hangar`);
    await screen.findByRole('table');

    await user.click(screen.getByRole('button', { name: 'Revision' }));
    expect(modelNames()).toEqual(['Albatross Scale', 'Meadowlark 40', 'Wren Trainer']);
    expect(screen.getByRole('columnheader', { name: 'Revision' })).toHaveAttribute('aria-sort', 'descending');
    expect(location().search).toBe('?sort=revision&dir=desc');

    await user.click(screen.getByRole('button', { name: 'Revision' }));
    expect(modelNames()).toEqual(['Wren Trainer', 'Meadowlark 40', 'Albatross Scale']);
    expect(screen.getByRole('columnheader', { name: 'Revision' })).toHaveAttribute('aria-sort', 'ascending');

    await user.click(screen.getByRole('button', { name: 'Checks' }));
    expect(modelNames()[0]).toBe('Meadowlark 40');
    expect(screen.getByRole('columnheader', { name: 'Revision' })).not.toHaveAttribute('aria-sort');
  });

  it('narrows the list to what the search names, and says when nothing matches', async () => {
    fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...hangarRoute(hangarModels()) });
    const { user } = renderApp(`/w/${CLUB}/hangar`);
    const search = await screen.findByRole('searchbox', { name: 'Search models' });

    await user.type(search, 'glider');
    await waitFor(() => expect(modelNames()).toEqual(['Albatross Scale']));
    expect(await screen.findByText('1 model matches')).toBeInTheDocument();

    await user.clear(search);
    await user.type(search, 'MEADOW');
    await waitFor(() => expect(modelNames()).toEqual(['Meadowlark 40']));

    await user.type(search, 'x');
    expect(await screen.findByRole('heading', { name: 'No model matches “MEADOWx”' })).toBeInTheDocument();
    expect(screen.queryByRole('table')).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Clear the search' }));
    await waitFor(() => expect(modelNames()).toHaveLength(3));
  });

  it('invites an owner to add the first model of an empty hangar', async () => {
    fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...hangarRoute([]) });
    const { user } = renderApp(`/w/${CLUB}/hangar`);

    expect(await screen.findByRole('heading', { name: 'No models in this hangar yet' })).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Add the first model' }));
    expect(screen.getByRole('dialog', { name: 'New model' })).toBeInTheDocument();
  });

  it('offers no new model to a reviewer', async () => {
    fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...hangarRoute(hangarModels(), BUILDERS) });
    renderApp(`/w/${BUILDERS}/hangar`);

    await screen.findByRole('table');
    expect(screen.queryByRole('button', { name: 'New model' })).not.toBeInTheDocument();
    expect(screen.getByText(/Your role here is reviewer/)).toBeInTheDocument();
  });

  it('creates a blank model and opens it', async () => {
    const created = modelRecord('Heron 2', [fixtureText('valid/trainer-single-receiver.yaml')]);
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...hangarRoute([]),
      ...modelRoutes([created]),
      [`POST /api/workspaces/${CLUB}/models`]: () => ({
        status: 201,
        body: { data: { model: modelView(created), revision: created.revisions[0] } },
      }),
    });
    const { user, location } = renderApp(`/w/${CLUB}/hangar`);
    await user.click(await screen.findByRole('button', { name: 'New model' }));
    const dialog = screen.getByRole('dialog', { name: 'New model' });

    await user.click(within(dialog).getByRole('button', { name: 'Create model' }));
    expect(within(dialog).getByText('Give the model a name.')).toBeInTheDocument();
    expect(server.called('POST', `/api/workspaces/${CLUB}/models`)).toHaveLength(0);

    await user.type(within(dialog).getByRole('textbox', { name: 'Name' }), 'Heron 2');
    await user.click(within(dialog).getByRole('button', { name: 'Create model' }));
    await waitFor(() => expect(location().pathname).toBe(`/models/${created.id}/overview`));
    expect(server.called('POST', `/api/workspaces/${CLUB}/models`)[0].body).toEqual({ name: 'Heron 2' });
  });
});

describe('New model from a file', () => {
  it('sends the file and shows where the server could not read it', async () => {
    const text = 'format: bindery-setup/1\nmodel: { name: Broken\n';
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...hangarRoute([]),
      [`POST /api/workspaces/${CLUB}/models/upload`]: () => ({
        status: 422,
        body: {
          error: {
            code: 'unreadable-setup',
            message: 'The setup could not be read as YAML, so nothing was saved.',
            details: { findings: analyzeSetup(text).findings },
          },
        },
      }),
    });
    const { user } = renderApp(`/w/${CLUB}/hangar`);
    await user.click(await screen.findByRole('button', { name: 'New model' }));
    const dialog = screen.getByRole('dialog', { name: 'New model' });
    await user.click(within(dialog).getByRole('radio', { name: 'From a file' }));

    await user.click(within(dialog).getByRole('button', { name: 'Upload and create' }));
    expect(within(dialog).getByText('Choose a .yaml or .yml file.')).toBeInTheDocument();

    await user.upload(
      within(dialog).getByLabelText('Setup file'),
      new File([text], 'broken.yaml', { type: 'application/yaml' }),
    );
    await user.click(within(dialog).getByRole('button', { name: 'Upload and create' }));

    expect(await within(dialog).findByRole('alert')).toHaveTextContent('nothing was saved');
    const [syntax] = analyzeSetup(text).findings;
    expect(within(dialog).getByText(syntax.message)).toBeInTheDocument();
    expect(within(dialog).getByText(`line ${syntax.line}:${syntax.column}`)).toBeInTheDocument();
    const sent = server.fetch.mock.calls.find(([url]) => typeof url === 'string' && url.endsWith('/models/upload'))![1]!
      .body as FormData;
    expect((sent.get('file') as File).name).toBe('broken.yaml');
  });
});

describe('A hangar longer than a page', () => {
  // 120 models: two full pages of 50 and a last one of 20.
  const fleet = () => {
    const yaml = fixtureText('valid/trainer-single-receiver.yaml');
    return Array.from({ length: 120 }, (_, n) => modelRecord(`Fleet ${String(n + 1).padStart(3, '0')}`, [yaml]));
  };
  const askedOf = (server: ReturnType<typeof fakeServer>) =>
    server.called('GET', `/api/workspaces/${CLUB}/models`).map((request) => request.url.searchParams);

  it('shows the first page with how many of how many, and Show more reads the next page by its cursor', async () => {
    const models = fleet();
    const server = fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...hangarRoute(models) });
    const { user } = renderApp(`/w/${CLUB}/hangar`);

    expect(await screen.findByText('Showing 50 of 120 models.')).toBeInTheDocument();
    expect(screen.getByText('120 models')).toBeInTheDocument();
    expect(modelNames()).toHaveLength(50);
    expect(modelNames().at(-1)).toBe('Fleet 050');

    await user.click(screen.getByRole('button', { name: 'Show more' }));
    expect(await screen.findByText('Showing 100 of 120 models.')).toBeInTheDocument();
    expect(modelNames().slice(49, 51)).toEqual(['Fleet 050', 'Fleet 051']);
    expect(askedOf(server).at(-1)?.get('after')).toBe(models[49].id);

    await user.click(screen.getByRole('button', { name: 'Show more' }));
    await waitFor(() => expect(modelNames()).toHaveLength(120));
    expect(screen.queryByRole('button', { name: 'Show more' })).not.toBeInTheDocument();
    expect(askedOf(server).every((params) => params.get('limit') === '50')).toBe(true);
  });

  it('asks the server to search, so a model far past the first page is found', async () => {
    const server = fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...hangarRoute(fleet()) });
    const { user } = renderApp(`/w/${CLUB}/hangar`);
    await screen.findByText('Showing 50 of 120 models.');

    await user.type(screen.getByRole('searchbox', { name: 'Search models' }), 'fleet 117');
    await waitFor(() => expect(modelNames()).toEqual(['Fleet 117']));
    expect(screen.getByText('1 model matches')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Show more' })).not.toBeInTheDocument();
    expect(askedOf(server).at(-1)?.get('q')).toBe('fleet 117');
  });
});

describe('Show archived models', () => {
  // Two models in use and one archived: the server lists the archived one only when
  // asked, and says how many archived models there are either way.
  function archiveRoute(): Record<string, FakeHandler> {
    const yaml = fixtureText('valid/trainer-single-receiver.yaml');
    const inUse = [modelRecord('Heron 2', [yaml]), modelRecord('Wren Trainer', [yaml])];
    const archived = modelRecord('Old trainer', [yaml]);
    return {
      [`GET /api/workspaces/${CLUB}/models`]: ({ url }) => {
        const listed = url.searchParams.get('archived') === 'include' ? [...inUse, archived] : inUse;
        const { body } = keysetPage(listed.map(modelView), url) as {
          body: { data: unknown[]; pagination: Record<string, unknown> };
        };
        return { body: { ...body, pagination: { ...body.pagination, archived: 1 } } };
      },
    };
  }
  const box = () => screen.getByRole('checkbox', { name: 'Show archived models (1)' });
  // A click as the browser has it: outside act(), which would run the router's
  // transition along with the click, so the box is read before the address has caught up.
  const clickNow = (element: HTMLElement) => {
    const scope = globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean };
    const before = scope.IS_REACT_ACT_ENVIRONMENT;
    scope.IS_REACT_ACT_ENVIRONMENT = false;
    try {
      element.click();
    } finally {
      scope.IS_REACT_ACT_ENVIRONMENT = before;
    }
  };

  it('shows the box ticked the moment it is clicked, before the address catches up, and unticked the same way', async () => {
    fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...archiveRoute() });
    const { location } = renderApp(`/w/${CLUB}/hangar`);
    await screen.findByRole('table');
    expect(modelNames()).toEqual(['Heron 2', 'Wren Trainer']);

    clickNow(box());
    expect(box()).toBeChecked();
    expect(screen.queryByRole('link', { name: 'Old trainer' })).not.toBeInTheDocument();
    await waitFor(() => expect(modelNames()).toEqual(['Heron 2', 'Old trainer', 'Wren Trainer']));
    expect(location().search).toBe('?archived=show');
    expect(box()).toBeChecked();

    clickNow(box());
    expect(box()).not.toBeChecked();
    await waitFor(() => expect(modelNames()).toEqual(['Heron 2', 'Wren Trainer']));
    expect(location().search).toBe('');
  });

  it('follows the address when it changes otherwise', async () => {
    fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...archiveRoute() });
    const { router } = renderApp(`/w/${CLUB}/hangar?archived=show`);
    await screen.findByRole('table');
    expect(box()).toBeChecked();

    fireEvent.click(box());
    await waitFor(() => expect(router.state.location.search).toBe(''));
    await act(() => router.navigate(`/w/${CLUB}/hangar?archived=show`));
    expect(box()).toBeChecked();
    await waitFor(() => expect(modelNames()).toContain('Old trainer'));
  });
});
