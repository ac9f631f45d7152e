import { screen } from '@testing-library/react';
import { fakeServer, sessionRoutes } from '../fake-server';
import { fixtureText, modelRecord, modelRoutes } from '../models/model-data';
import { renderApp } from '../render-app';

describe('History: the git export', () => {
  it('offers the model’s whole history as a git bundle to download, for every role that can read it', async () => {
    const model = modelRecord('Kestrel Twin', [fixtureText('pairs/trim-tuning.before.yaml')], { role: 'viewer' });
    fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...modelRoutes([model]) });
    renderApp(`/models/${model.id}/history`);

    const link = await screen.findByRole('link', { name: 'Export full history' });
    expect(link).toHaveAttribute('href', `/api/models/${model.id}/export.git`);
    expect(link).toHaveAttribute('download');
    expect(link).toHaveAccessibleDescription(
      'A backup file of the whole history, one entry per revision. Git (a common version-control tool) opens it; Backups can bring it back into Bindery.',
    );
  });
});
