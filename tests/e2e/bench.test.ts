import { describe, expect, it } from 'vitest';
import { apiAs, demoModel } from './support/api';
import { useBrowser } from './support/browser';
import { baseUrl, demoAccount } from './support/demo';
import { saveScreenshot } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';

const browser = useBrowser();

const rowCells = async (row: import('playwright-core').Locator) =>
  (await row.getByRole('cell').allTextContents()).map((cell) => cell.replace(/\s+/g, ' ').trim());

describe('journey: the bench', () => {
  it('moves the elevator stick of the Kestrel to full and reads the pulse on its channel and pin, then loses the wing receiver alone and then every receiver', async () => {
    const viewer = demoAccount('viewer');
    const kestrel = await demoModel(await apiAs(viewer), 'Kestrel Mk II');
    const visit = await signedIn(browser(), viewer);
    const { page } = visit;
    await page.goto(`${baseUrl}/models/${kestrel.id}/bench`);
    await page.getByRole('heading', { name: 'Bench', exact: true }).waitFor();

    const channels = page.getByRole('table', { name: /Each channel's value and pulse/ });
    const elevatorChannel = channels
      .getByRole('row')
      .filter({ has: page.getByRole('cell', { name: '2', exact: true }) });
    await elevatorChannel.waitFor();
    expect((await rowCells(elevatorChannel)).at(-1)).toBe('1500');

    const stick = page.getByRole('slider', { name: 'elevator-stick' });
    await stick.focus();
    await stick.press('End');
    expect(await stick.inputValue()).toBe('100');
    // The elevator mix has weight 92 (flap compensation is off with the flap switch at 0):
    // 92 % of the 500 µs half-travel above the 1500 µs centre is 1960 µs.
    await channels.getByRole('cell', { name: '1960', exact: true }).waitFor();
    expect((await rowCells(elevatorChannel)).slice(-2)).toEqual(['92', '1960']);
    const fuselagePins = page.getByRole('table', { name: /^Pins of Fuselage receiver/ });
    const pin2 = fuselagePins
      .getByRole('row')
      .filter({ has: page.getByRole('cell', { name: '2', exact: true }) })
      .first();
    expect(await rowCells(pin2)).toContain('1960');
    await saveScreenshot(page, 'journey-06-bench-elevator-up');

    // One receiver loses the link: the wing unit's pins go to their failsafes while the
    // fuselage unit keeps the link and its pin 2 still follows the elevator stick.
    await page.getByLabel('Wing receiver (red tape) loses the link').check();
    const wingLost = page.getByRole('table', { name: /^Pins of Wing receiver.*with the link lost/ });
    const wingPin1 = wingLost
      .getByRole('row')
      .filter({ has: page.getByRole('cell', { name: '1', exact: true }) })
      .first();
    await wingPin1.waitFor();
    expect(await rowCells(wingPin1)).toEqual(['1', '9', 'tailwheel', '1500', 'failsafe (1500 µs)', '1500 µs']);
    const fuselageLive = page.getByRole('table', { name: /^Pins of Fuselage receiver.*now/ });
    const livePin2 = fuselageLive
      .getByRole('row')
      .filter({ has: page.getByRole('cell', { name: '2', exact: true }) })
      .first();
    expect((await rowCells(livePin2)).slice(3, 5)).toEqual(['1960', 'live']);
    await saveScreenshot(page, 'journey-06-bench-wing-lost');

    // Every receiver lost: the motor's pin 3 goes to its 1000 µs stop, the elevator to 1500 µs.
    await page.getByRole('button', { name: 'Lose every receiver' }).click();
    const lost = page.getByRole('table', { name: /^Pins of Fuselage receiver.*with the link lost/ });
    const pin3 = lost
      .getByRole('row')
      .filter({ has: page.getByRole('cell', { name: '3', exact: true }) })
      .first();
    await pin3.waitFor();
    expect(await rowCells(pin3)).toContain('1000');
    const pin2Lost = lost
      .getByRole('row')
      .filter({ has: page.getByRole('cell', { name: '2', exact: true }) })
      .first();
    expect((await rowCells(pin2Lost)).slice(3, 5)).toEqual(['1500', 'failsafe (1500 µs)']);
    await saveScreenshot(page, 'journey-06-bench-link-lost');
    expectNoProblems(visit);
    await visit.context.close();
  });
});
