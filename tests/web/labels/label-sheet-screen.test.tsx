import { screen, waitFor } from '@testing-library/react';
import { CLUB, fakeServer, keysetPage, sessionRoutes } from '../fake-server';
import { uuid } from '../models/model-data';
import { renderApp } from '../render-app';
import { unitRecord } from '../shelf/shelf-data';

// A sheet for the whole shelf reads one page of the shelf at once, and the rest only when
// asked for, one page after another with the count on screen; a sheet of chosen units
// reads just those units.
const labelsShown = () => document.querySelectorAll('.label-sheet .unit-label').length;

function shelfOf(count: number) {
  const units = Array.from({ length: count }, (_, n) =>
    unitRecord(null, { id: uuid(7000), label: `Rack unit ${String(n + 1).padStart(3, '0')}` }),
  );
  const server = fakeServer({
    ...sessionRoutes({ signedIn: true }).routes,
    [`GET /api/workspaces/${CLUB}/receivers`]: ({ url }) => keysetPage(units, url),
    ...Object.fromEntries(units.map((unit) => [`GET /api/receivers/${unit.id}`, () => ({ body: { data: unit } })])),
  });
  const shelfRequests = () =>
    server.called('GET', `/api/workspaces/${CLUB}/receivers`).map((request) => request.url.searchParams);
  return { units, server, shelfRequests };
}

describe('Label sheet', () => {
  it('labels the first page of a large shelf, and the rest only when asked, page after page', async () => {
    const { units, shelfRequests } = shelfOf(230);
    const { user } = renderApp(`/w/${CLUB}/shelf/labels?sheet=single`);

    expect(
      await screen.findByText('The labels below are for the first 200 of 230 units, by label.'),
    ).toBeInTheDocument();
    expect(labelsShown()).toBe(200);
    expect(shelfRequests().every((params) => params.get('limit') === '200' && !params.has('after'))).toBe(true);

    await user.click(screen.getByRole('button', { name: 'Prepare all 230 labels' }));
    await waitFor(() => expect(labelsShown()).toBe(230));
    expect(screen.queryByRole('button', { name: /Prepare all/ })).not.toBeInTheDocument();
    expect(screen.getByText(/^230 labels on 230 labels/)).toBeInTheDocument();
    expect(
      shelfRequests()
        .filter((params) => params.has('after'))
        .map((params) => params.get('after')),
    ).toEqual([units[199].id]);
  });

  it('reads only the units the address picks, not the shelf', async () => {
    const { units, server, shelfRequests } = shelfOf(60);
    renderApp(`/w/${CLUB}/shelf/labels?sheet=single&units=${units[3].id},${units[57].id}`);

    await waitFor(() => expect(labelsShown()).toBe(2));
    expect(screen.getByText('Rack unit 058')).toBeInTheDocument();
    expect(shelfRequests()).toHaveLength(0);
    expect(server.called('GET', `/api/receivers/${units[57].id}`).length).toBeGreaterThan(0);
    expect(server.called('GET', `/api/receivers/${units[4].id}`)).toHaveLength(0);
  });
});
