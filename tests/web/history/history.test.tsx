import { screen, waitFor, within } from '@testing-library/react';
import { BUILDERS, fakeServer, sessionRoutes } from '../fake-server';
import { fixtureText, modelRecord, modelRoutes, revisionOf, summaryOf } from '../models/model-data';
import { renderApp } from '../render-app';

function threeRevisions(extra = {}) {
  return modelRecord(
    'Kestrel Twin',
    [
      fixtureText('pairs/trim-tuning.before.yaml'),
      fixtureText('pairs/trim-tuning.after.yaml'),
      fixtureText('pairs/trim-tuning.before.yaml'),
    ],
    extra,
  );
}

const pick = (number: number) => screen.getByRole('checkbox', { name: `Pick revision ${number} to compare` });

describe('History', () => {
  it('lists the revisions newest first with their author, checks and tags', async () => {
    const model = threeRevisions();
    model.revisions[1].tags = ['maiden'];
    fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...modelRoutes([model]) });
    renderApp(`/models/${model.id}/history`);

    const entries = await screen.findAllByRole('article');
    expect(entries.map((entry) => within(entry).getByRole('heading').textContent)).toEqual([
      'r3Revision 3latest',
      'r2Revision 2',
      'r1Revision 1',
    ]);
    expect(within(entries[1]).getByText('maiden')).toBeInTheDocument();
    expect(entries[0]).toHaveTextContent('by Wren Calloway');
    expect(within(entries[2]).getByRole('link', { name: 'Download .yaml' })).toHaveAttribute(
      'href',
      `/api/revisions/${model.revisions[0].id}?format=yaml&download=1`,
    );
  });

  it('compares the two revisions picked, older as from, and lets a third pick replace the first', async () => {
    const model = threeRevisions();
    fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...modelRoutes([model]) });
    const { user, location } = renderApp(`/models/${model.id}/history`);
    await screen.findAllByRole('article');

    expect(screen.getByRole('button', { name: 'Compare' })).toBeDisabled();
    await user.click(pick(3));
    await user.click(pick(1));
    expect(screen.getByText('Revisions 1 and 3 picked.')).toBeInTheDocument();

    await user.click(pick(2));
    expect(pick(3)).not.toBeChecked();
    expect(pick(1)).toBeChecked();
    expect(pick(2)).toBeChecked();

    await user.click(screen.getByRole('button', { name: 'Compare r1 with r2' }));
    await waitFor(() => expect(location().pathname).toBe(`/models/${model.id}/compare`));
    expect(location().search).toBe(`?from=${model.revisions[0].id}&to=${model.revisions[1].id}`);
  });

  it('reverts to an old revision on top of the latest, with the message given', async () => {
    const model = threeRevisions();
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...modelRoutes([model]),
      [`POST /api/models/${model.id}/revert`]: ({ body }) => {
        const { number } = body as { number: number };
        const revision = revisionOf(model.id, 4, model.revisions[number - 1].yaml, {
          origin: 'revert',
          source_revision_id: model.revisions[number - 1].id,
        });
        model.revisions.push(revision);
        return { status: 201, body: { data: { ...summaryOf(revision), findings: revision.findings } } };
      },
    });
    const { user } = renderApp(`/models/${model.id}/history`);
    const entries = await screen.findAllByRole('article');
    expect(within(entries[0]).queryByRole('button', { name: 'Revert to this' })).not.toBeInTheDocument();

    await user.click(within(entries[1]).getByRole('button', { name: 'Revert to this' }));
    const dialog = screen.getByRole('dialog', { name: 'Revert to revision 2' });
    const message = within(dialog).getByRole('textbox', { name: 'Message' });
    await user.clear(message);
    await user.type(message, 'Back to the softer rates');
    await user.click(within(dialog).getByRole('button', { name: 'Revert' }));

    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    expect(server.called('POST', `/api/models/${model.id}/revert`)[0].body).toEqual({
      number: 2,
      base: 3,
      message: 'Back to the softer rates',
    });
    expect(await screen.findByRole('article', { name: /^r4/ })).toHaveTextContent('a revert to r2');
  });

  it('adds and removes a tag', async () => {
    const model = threeRevisions();
    const target = model.revisions[0];
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...modelRoutes([model]),
      [`POST /api/revisions/${target.id}/tags`]: ({ body }) => {
        target.tags = [...target.tags, (body as { name: string }).name].sort();
        return { status: 201, body: { data: { revision_id: target.id, number: 1, tags: target.tags } } };
      },
      [`DELETE /api/revisions/${target.id}/tags/maiden`]: () => {
        target.tags = target.tags.filter((tag) => tag !== 'maiden');
        return { body: { data: { revision_id: target.id, number: 1, tags: target.tags } } };
      },
    });
    const { user } = renderApp(`/models/${model.id}/history`);
    await screen.findAllByRole('article');

    await user.click(screen.getByRole('button', { name: 'Add a tag to revision 1' }));
    const input = screen.getByRole('textbox', { name: 'New tag for revision 1' });
    await user.type(input, 'Maiden!');
    await user.click(screen.getByRole('button', { name: 'Add' }));
    expect(screen.getByText(/lower-case letters, digits and dashes/)).toBeInTheDocument();
    expect(server.called('POST', `/api/revisions/${target.id}/tags`)).toHaveLength(0);

    await user.clear(input);
    await user.type(input, 'maiden');
    await user.click(screen.getByRole('button', { name: 'Add' }));
    const remove = await screen.findByRole('button', { name: 'Remove tag maiden from revision 1' });
    expect(server.called('POST', `/api/revisions/${target.id}/tags`)[0].body).toEqual({ name: 'maiden' });

    await user.click(remove);
    await waitFor(() =>
      expect(screen.queryByRole('button', { name: 'Remove tag maiden from revision 1' })).not.toBeInTheDocument(),
    );
  });

  it('offers a reviewer no revert and no tag editing', async () => {
    const model = threeRevisions({ workspace_id: BUILDERS, role: 'reviewer' });
    fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...modelRoutes([model]) });
    renderApp(`/models/${model.id}/history`);
    await screen.findAllByRole('article');
    expect(screen.queryByRole('button', { name: 'Revert to this' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Add a tag/ })).not.toBeInTheDocument();
    expect(screen.getAllByRole('button', { name: 'Fork' })).toHaveLength(3);
  });
});
