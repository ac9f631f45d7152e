import { screen, waitFor, within } from '@testing-library/react';
import { apiError, fakeServer, sessionRoutes } from '../fake-server';
import { fixtureText, modelRecord, modelRoutes } from '../models/model-data';
import { renderApp } from '../render-app';

function openOverview(fixture: string) {
  const model = modelRecord('Meadowlark 40', [fixtureText(fixture)]);
  fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...modelRoutes([model]) });
  const app = renderApp(`/models/${model.id}/overview`);
  return { model, ...app };
}

const channelRow = (ch: number) => screen.getByRole('row', { name: new RegExp(`^${ch} `) });

describe('Overview', () => {
  it('marks two functions on one channel as a conflict, in words', async () => {
    openOverview('invalid/channel-shared.yaml');
    const grid = await screen.findByRole('table', { name: /Channel plan/ });

    const row = within(grid).getByRole('row', { name: /^4 / });
    const functionCell = within(row).getAllByRole('cell')[0];
    expect(
      within(functionCell)
        .getAllByRole('listitem')
        .map((item) => item.textContent),
    ).toEqual(['rudderrudder', 'tow-releaseaux']);
    expect(within(row).getByText('Conflict: shared channel')).toBeInTheDocument();
    expect(within(channelRow(3)).queryByText('Conflict: shared channel')).not.toBeInTheDocument();
    // The receiver column shows the pin that carries channel 4 and its failsafe.
    expect(within(row).getByText('Pin 4')).toBeInTheDocument();
  });

  it('marks a channel no pin carries as unrouted', async () => {
    openOverview('invalid/function-unrouted.yaml');
    await screen.findByRole('table', { name: /Channel plan/ });
    expect(within(channelRow(4)).getByText('Unrouted: on no pin')).toBeInTheDocument();
    expect(within(channelRow(2)).queryByText('Unrouted: on no pin')).not.toBeInTheDocument();
  });

  it('draws channels beyond the link below a divider and marks them', async () => {
    openOverview('invalid/channel-beyond-link.yaml');
    const grid = await screen.findByRole('table', { name: /Channel plan/ });
    expect(screen.getByText('The link carries 4 channels.')).toBeInTheDocument();
    expect(within(grid).getByText(/Beyond the link: it carries 4 channels/)).toBeInTheDocument();
    expect(within(channelRow(5)).getByText('Beyond the link')).toBeInTheDocument();
    expect(within(channelRow(4)).queryByText('Beyond the link')).not.toBeInTheDocument();
  });

  it('shows telemetry per receiver, the findings with links to their lines, and the cautions', async () => {
    const { model, user, location } = openOverview('invalid/channel-shared.yaml');
    await screen.findByRole('table', { name: /Channel plan/ });

    expect(
      within(screen.getByRole('columnheader', { name: /Receiver cabin/ })).getByText('Sends telemetry'),
    ).toBeInTheDocument();
    const finding = model.revisions[0].findings.find((f) => f.rule === 'channel-shared')!;
    const findings = screen.getByRole('region', { name: /Findings of revision 1/ });
    const link = within(findings).getByRole('link', {
      name: new RegExp(finding.message.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')),
    });
    expect(link).toHaveAttribute('href', `/models/${model.id}/edit?line=${finding.line}`);
    expect(screen.getByRole('region', { name: 'Cautions before programming or flying' })).toHaveTextContent(
      'propeller removed',
    );

    await user.click(link);
    await waitFor(() => expect(location().pathname).toBe(`/models/${model.id}/edit`));
    expect(location().search).toBe(`?line=${finding.line}`);
  });

  it('says so when the model cannot be loaded', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      'GET /api/models/missing': () => apiError(404, 'not-found', 'That model was not found.'),
    });
    renderApp('/models/missing/overview');
    expect(await screen.findByRole('alert')).toHaveTextContent('That model was not found.');
    expect(screen.getByRole('heading', { level: 1, name: 'Overview' })).toBeInTheDocument();
  });
});
