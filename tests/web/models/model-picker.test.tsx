import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { AppProvider } from '@web/app/provider';
import { SessionContext } from '@web/features/auth/hooks/use-session';
import { ForkFields, useForkForm } from '@web/features/models/components/fork-fields';
import { createQueryClient } from '@web/lib/query-client';
import type { Session, WorkspaceMembership } from '@web/types/api';
import { CLUB, demoUser, demoWorkspaces, fakeServer, keysetPage, type FakeHandler } from '../fake-server';
import { fixtureText, modelRecord, modelRoutes, modelView, type ModelRecord } from './model-data';

// The model picker of the fork form, in the form itself (as the hangar's New model
// dialog draws it): the real components and query client, with `fetch` answering as
// the API does. The picker asks the server for every search; it never lists a hangar whole.
const session: Session = {
  user: demoUser,
  workspaces: demoWorkspaces as WorkspaceMembership[],
  workspacesTotal: demoWorkspaces.length,
};

function hangarModels(): ModelRecord[] {
  const trainer = fixtureText('valid/trainer-single-receiver.yaml');
  return [
    modelRecord(
      'Albatross Scale',
      [1, 2, 3].map(() => fixtureText('valid/scale-16-channel-two-receivers.yaml')),
      {
        airframe: 'glider',
      },
    ),
    modelRecord('Meadowlark 40', [trainer, trainer]),
    modelRecord('Wren Trainer', [trainer]),
  ];
}

// The hangar's search as the server answers it here: the name or airframe contains the words.
function serve(models: ModelRecord[]) {
  const search: Record<string, FakeHandler> = {
    [`GET /api/workspaces/${CLUB}/models`]: ({ url }) => {
      const q = url.searchParams.get('q')?.toLowerCase() ?? '';
      const matching = models.filter((model) => `${model.name}\n${model.airframe ?? ''}`.toLowerCase().includes(q));
      return keysetPage(matching.map(modelView), url);
    },
  };
  const server = fakeServer({ ...search, ...modelRoutes(models) });
  const searches = () =>
    server.called('GET', `/api/workspaces/${CLUB}/models`).map((request) => request.url.searchParams.get('q'));
  return { server, searches };
}

function ForkForm() {
  const fork = useForkForm({ target: session.workspaces[0], onForked: () => {} });
  return (
    <form onSubmit={fork.submit}>
      <ForkFields fork={fork} chooseSource />
      <button type="submit">Fork</button>
    </form>
  );
}

function renderForkForm() {
  const user = userEvent.setup();
  render(
    <AppProvider queryClient={createQueryClient()}>
      <SessionContext.Provider value={session}>
        <ForkForm />
      </SessionContext.Provider>
    </AppProvider>,
  );
  return user;
}

const modelSelect = () => screen.getByRole('combobox', { name: 'Model' });
const choices = () =>
  within(modelSelect())
    .getAllByRole('option')
    .map((option) => option.textContent);

describe('The fork form’s model picker', () => {
  it('lists the first matches, and asks the server for what the pilot types', async () => {
    const { searches } = serve(hangarModels());
    const user = renderForkForm();
    await waitFor(() => expect(modelSelect()).toBeEnabled());
    expect(choices()).toEqual([
      'Choose a model…',
      'Albatross Scale (latest r3)',
      'Meadowlark 40 (latest r2)',
      'Wren Trainer (latest r1)',
    ]);
    expect(searches()).toEqual([null]);

    await user.type(screen.getByRole('searchbox', { name: 'Find in the hangar' }), 'glider');
    await waitFor(() => expect(choices()).toEqual(['Choose a model…', 'Albatross Scale (latest r3)']));
    expect(searches().at(-1)).toBe('glider');
  });

  it('fills the form with the model chosen: its latest revision to copy and the fork’s name', async () => {
    const models = hangarModels();
    const { server } = serve(models);
    const user = renderForkForm();
    await waitFor(() => expect(modelSelect()).toBeEnabled());

    await user.click(screen.getByRole('button', { name: 'Fork' }));
    expect(await screen.findByText('Choose the model to fork.')).toBeInTheDocument();

    await user.selectOptions(modelSelect(), 'Meadowlark 40 (latest r2)');
    expect(modelSelect()).toHaveDisplayValue('Meadowlark 40 (latest r2)');
    const revision = await screen.findByRole('combobox', { name: 'Revision' });
    await waitFor(() => expect(revision).toHaveValue('2'));
    expect(screen.getByText('Left empty: “Meadowlark 40 (fork)”.')).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Fork' }));
    await waitFor(() => expect(server.called('POST', `/api/models/${models[1].id}/fork`)).toHaveLength(1));
    expect(server.called('POST', `/api/models/${models[1].id}/fork`)[0].body).toEqual({ number: 2, workspace: CLUB });
  });

  it('says so when nothing matches the search', async () => {
    const { searches } = serve(hangarModels());
    const user = renderForkForm();
    await waitFor(() => expect(modelSelect()).toBeEnabled());

    await user.type(screen.getByRole('searchbox', { name: 'Find in the hangar' }), 'biplane');
    await waitFor(() => expect(choices()).toEqual(['No model matches “biplane”']));
    expect(searches().at(-1)).toBe('biplane');
  });
});
