import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiAs, demoModel, demoWorkspaceId } from './support/api';
import { seriousA11yViolations } from './support/axe';
import { useBrowser, type Visit } from './support/browser';
import { baseUrl, demoAccount } from './support/demo';
import { saveScreenshot } from './support/screenshots';
import { signedIn } from './support/session';
import { elementsPastTheEdge, smallTouchTargets } from './support/touch-targets';

// A phone in the pit area, 375 px wide: each screen used at the field fits without
// sideways scrolling, every control is a thumb's size (44 px), axe finds nothing
// serious and the browser logs no error.

const browser = useBrowser();
const ids = { workspace: '', kestrel: '', review: '', pipit: '' };
let visit: Visit;

interface Screen {
  name: string;
  path: () => string;
  ready: (page: Page) => Promise<unknown>;
}

const SCREENS: Screen[] = [
  {
    name: 'overview',
    path: () => `/models/${ids.kestrel}/overview`,
    ready: (page) => page.getByRole('heading', { name: 'Channel plan' }).waitFor(),
  },
  {
    name: 'field-sheet',
    path: () => `/models/${ids.kestrel}/sheet`,
    ready: (page) => page.getByText('Revision 12, the latest.').waitFor(),
  },
  {
    name: 'bench',
    path: () => `/models/${ids.kestrel}/bench`,
    ready: (page) => page.getByRole('heading', { name: 'Mix curves' }).waitFor(),
  },
  {
    name: 'review',
    path: () => `/w/${ids.workspace}/reviews/${ids.review}`,
    ready: (page) => page.getByRole('heading', { name: 'Pre-maiden checklist' }).waitFor(),
  },
  {
    name: 'shelf',
    path: () => `/w/${ids.workspace}/shelf`,
    ready: (page) => page.getByRole('link', { name: 'Pipit trainer unit' }).waitFor(),
  },
  {
    name: 'shelf-unit',
    path: () => `/w/${ids.workspace}/shelf/${ids.pipit}`,
    ready: (page) => page.getByRole('heading', { name: 'Settings it holds' }).waitFor(),
  },
  {
    name: 'labels',
    path: () => `/w/${ids.workspace}/shelf/labels`,
    ready: (page) => page.locator('.unit-label').first().waitFor(),
  },
];

beforeAll(async () => {
  const owner = demoAccount('owner');
  const api = await apiAs(owner);
  ids.workspace = await demoWorkspaceId(api);
  ids.kestrel = (await demoModel(api, 'Kestrel Mk II')).id;
  const reviews = await api.get<{ id: string; state: string }[]>(`/models/${ids.kestrel}/reviews`);
  ids.review = reviews.find((review) => review.state === 'open')!.id;
  const shelf = await api.get<{ id: string; label: string }[]>(`/workspaces/${ids.workspace}/receivers`);
  ids.pipit = shelf.find((unit) => unit.label === 'Pipit trainer unit')!.id;
  visit = await signedIn(browser(), owner, 'phone');
});

afterAll(async () => {
  await visit?.context.close();
});

describe('at 375 px, on a phone', () => {
  it.each(SCREENS.map((screen) => [screen.name, screen] as const))(
    '%s fits, has thumb-sized controls, and no serious accessibility finding',
    async (name, screen) => {
      const { page } = visit;
      const problemsBefore = visit.problems.all.length;
      await page.goto(`${baseUrl}${screen.path()}`);
      await screen.ready(page);
      await page.evaluate(() => document.fonts.ready.then(() => undefined));
      await saveScreenshot(page, `phone-${name}-375`);

      const overflow = await page.evaluate(
        () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
      );
      expect(
        overflow,
        `the page scrolls sideways at 375 px: ${(await elementsPastTheEdge(page)).join('; ')}`,
      ).toBeLessThanOrEqual(0);
      expect(await smallTouchTargets(page)).toEqual([]);
      expect(await seriousA11yViolations(page)).toEqual([]);
      expect(visit.problems.all.slice(problemsBefore)).toEqual([]);
    },
  );

  it('stacks each bench table row with its column names, so no table scrolls sideways', async () => {
    const { page } = visit;
    await page.goto(`${baseUrl}/models/${ids.kestrel}/bench`);
    await page.getByRole('heading', { name: 'Mix curves' }).waitFor();
    const tables = page.locator('table');
    expect(await tables.count()).toBeGreaterThan(1);
    const layout = await tables.evaluateAll((all) =>
      all.map((table) => {
        const box = table.parentElement!;
        const cell = table.querySelector('tbody td')!;
        return {
          scrolls: box.scrollWidth > box.clientWidth,
          display: getComputedStyle(cell).display,
          names: [...table.querySelectorAll('tbody tr:first-child td')].map((td) =>
            getComputedStyle(td, '::before').content.replace(/"/g, ''),
          ),
        };
      }),
    );
    for (const table of layout) {
      expect(table.scrolls).toBe(false);
      expect(table.display).toBe('flex');
    }
    expect(layout.map((table) => table.names)).toContainEqual(['Channel', 'Function', 'Value', '%', 'Pulse µs']);
    expect(layout.map((table) => table.names)).toContainEqual([
      'Pin',
      'Channel',
      'Function',
      'Pulse µs',
      'State',
      'Failsafe',
    ]);
    // The table is still a table to a screen reader: its column headers are there, only hidden from sight.
    expect(await page.getByRole('columnheader', { name: 'Failsafe' }).count()).toBeGreaterThan(0);
    await saveScreenshot(page, 'phone-bench-tables-375');
  });
});
