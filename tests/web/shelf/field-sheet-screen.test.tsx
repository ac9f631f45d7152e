import { screen, within } from '@testing-library/react';
import { analyzeSetup } from '@shared/analyze';
import { sheetCut, sheetLinkLoss } from '@shared/contract/field-sheet';
import type { FieldSheet } from '@web/features/field-sheet/types';
import { fakeServer, sessionRoutes } from '../fake-server';
import { fixtureText, modelRecord, modelRoutes } from '../models/model-data';
import { renderApp } from '../render-app';

const yaml = fixtureText('valid/scale-16-channel-two-receivers.yaml');
const kestrel = modelRecord('Kestrel Mk II', [yaml, yaml]);

// The sheet as the API answers it, from the fixture's own setup.
function sheetOf(revision: (typeof kestrel.revisions)[number]): FieldSheet {
  const setup = analyzeSetup(revision.yaml).setup!;
  const plan = new Map(setup.channels.map((channel) => [channel.ch, channel]));
  return {
    model: {
      id: kestrel.id,
      name: kestrel.name,
      setup_name: setup.model.name,
      airframe: setup.model.airframe,
      wingspan_mm: 2100,
      weight_g: 6200,
    },
    revision: {
      id: revision.id,
      number: revision.number,
      content_hash: 'a'.repeat(64),
      short_hash: 'a'.repeat(12),
      created_at: revision.created_at,
      message: revision.message,
      author: revision.author,
    },
    review_state: 'approved',
    link: { channels: 16, packet_rate_hz: 150 },
    channels: setup.channels.map((channel) => ({
      ch: channel.ch,
      function: channel.function,
      role: channel.role,
      side: channel.side ?? null,
      reverse: channel.travel.reverse,
      cut: channel.cut ? sheetCut(channel.cut, setup) : null,
    })),
    receivers: setup.receivers.map((receiver) => ({
      id: receiver.id,
      label: receiver.label ?? null,
      role: receiver.role,
      outputs: receiver.outputs,
      telemetry: receiver.telemetry,
      pins: receiver.map.map((entry) => ({
        pin: entry.pin,
        ch: entry.ch,
        function: plan.get(entry.ch)?.function ?? null,
        role: plan.get(entry.ch)?.role ?? null,
        failsafe: entry.failsafe ?? null,
        link_loss: sheetLinkLoss(entry.failsafe),
      })),
      unit:
        receiver.id === 'wing'
          ? { id: 'unit-1', label: 'Kestrel wing unit', mark: 'Red tape', mark_colour: 'red' }
          : null,
    })),
    receiver_supply: 'separate-pack',
    counts: { errors: 0, warnings: 0, infos: 0 },
    findings: [],
    cautions: { heading: 'Cautions before programming or flying', items: [] },
  };
}

function serve() {
  return fakeServer({
    ...sessionRoutes({ signedIn: true }).routes,
    ...modelRoutes([kestrel]),
    ...Object.fromEntries(
      kestrel.revisions.map((revision) => [
        `GET /api/revisions/${revision.id}/field-sheet`,
        () => ({ body: { data: sheetOf(revision) } }),
      ]),
    ),
    [`GET /api/models/${kestrel.id}/revisions/1`]: () => ({ body: { data: kestrel.revisions[0] } }),
  });
}

describe('Field sheet', () => {
  it('shows the latest revision’s pin tables with the unit in each slot, the cautions, and the PDF link', async () => {
    serve();
    renderApp(`/models/${kestrel.id}/sheet`);
    const wing = await screen.findByRole('table', { name: /Pins of Wing receiver/ });
    const pin3 = within(wing).getAllByRole('row')[3];
    expect(
      within(pin3)
        .getAllByRole('cell')
        .map((cell) => cell.textContent),
    ).toEqual(['3', '11', 'landing-light', 'hold', 'held']);
    const fuselage = screen.getByRole('table', { name: /Pins of Fuselage receiver/ });
    // Pin 3 drives the motor: with the link lost it sends its 1000 µs failsafe.
    expect(
      within(within(fuselage).getAllByRole('row')[3])
        .getAllByRole('cell')
        .map((cell) => cell.textContent),
    ).toEqual(['3', '3', 'motor', '1000 µs', '1000 µs']);
    // The cut names its switch, position and value, not just that there is one.
    expect(screen.getByRole('table', { name: /^Channels 1 to/ })).toHaveTextContent(
      'cut: Arm (guarded) (motor-arm) at position 0 holds it at -100 %',
    );
    expect(screen.getByRole('region', { name: /Wing receiver/ })).toHaveTextContent(/Re-binding can clear/);
    expect(screen.getByRole('region', { name: /Wing receiver/ })).toHaveTextContent('Unit: Kestrel wing unitRed tape');
    expect(screen.getByRole('region', { name: /Fuselage receiver/ })).toHaveTextContent(
      'Unit: none on the shelf is installed here',
    );
    expect(screen.getByText('Approved')).toBeInTheDocument();
    expect(screen.getByRole('region', { name: 'Cautions before programming or flying' })).toHaveTextContent(
      'not a certification',
    );
    expect(screen.getByRole('link', { name: 'Download PDF' })).toHaveAttribute(
      'href',
      `/api/revisions/${kestrel.revisions[1].id}/field-sheet.pdf`,
    );
    expect(screen.getByText(/Revision 2, the latest/)).toBeInTheDocument();
    expect(document.title).toBe('Field sheet · Kestrel Mk II r2 · Bindery');
  });

  it('takes an older revision by its number from the address', async () => {
    serve();
    renderApp(`/models/${kestrel.id}/sheet?revision=1`);
    expect(await screen.findByText(/Revision 1 of 2/)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Download PDF' })).toHaveAttribute(
      'href',
      `/api/revisions/${kestrel.revisions[0].id}/field-sheet.pdf`,
    );
    expect(screen.getByRole('link', { name: 'Show the latest' })).toHaveAttribute(
      'href',
      `/models/${kestrel.id}/sheet`,
    );
  });

  it('says what is wrong with a revision parameter that names none', async () => {
    serve();
    renderApp(`/models/${kestrel.id}/sheet?revision=latest-but-one`);
    expect(await screen.findByRole('alert')).toHaveTextContent('does not name a revision');
  });
});
