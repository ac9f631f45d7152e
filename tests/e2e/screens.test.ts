import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiAs, demoModel, demoWorkspaceId } from './support/api';
import { seriousA11yViolations } from './support/axe';
import { openVisit, useBrowser, type ViewportName, type Visit } from './support/browser';
import { baseUrl, demoAccount } from './support/demo';
import { setupText } from './support/editor';
import { saveScreenshot } from './support/screenshots';
import { signInThroughForm } from './support/session';

// Every screen with the demo as seeded (this file runs before the journeys), at desktop
// and tablet width: a screenshot each to look over, the accessibility check at desktop
// width, no page-wide sideways scrolling at the tablet's width, no console errors or
// CSP violations.

const browser = useBrowser();

interface Screen {
  name: string;
  /** Signed out, or signed in as the demo owner. */
  signedOut?: boolean;
  path: () => string;
  /** Waits until the screen shows its data, by visible text. */
  ready: (page: Page) => Promise<unknown>;
  /** The text editor draws only the lines in the window, so its picture is of the window. */
  windowOnly?: boolean;
}

const ids = { workspace: '', kestrel: '', kestrelReview: '', pipit: '' };
const heading = (page: Page, name: string) => page.getByRole('heading', { name, exact: true }).first().waitFor();

const SCREENS: Screen[] = [
  { name: 'sign-in', signedOut: true, path: () => '/sign-in', ready: (page) => heading(page, 'Sign in') },
  {
    name: 'create-account',
    signedOut: true,
    path: () => '/create-account',
    ready: (page) => heading(page, 'Create account'),
  },
  {
    name: 'reset-password',
    signedOut: true,
    path: () => '/reset-password',
    ready: (page) => heading(page, 'Reset password'),
  },
  {
    name: 'hangar',
    path: () => `/w/${ids.workspace}/hangar`,
    ready: (page) => page.getByRole('link', { name: 'Kestrel Mk II' }).waitFor(),
  },
  {
    name: 'overview',
    path: () => `/models/${ids.kestrel}/overview`,
    ready: (page) => page.getByRole('heading', { name: 'Findings of revision 12' }).waitFor(),
  },
  {
    name: 'edit',
    windowOnly: true,
    path: () => `/models/${ids.kestrel}/edit`,
    ready: async (page) => {
      await setupText(page).waitFor();
      await page.getByText('The setup passes every check.').waitFor();
    },
  },
  {
    name: 'bench',
    path: () => `/models/${ids.kestrel}/bench`,
    ready: (page) => page.getByRole('heading', { name: 'Mix curves' }).waitFor(),
  },
  {
    name: 'history',
    path: () => `/models/${ids.kestrel}/history`,
    ready: (page) => page.getByText('First channel plan: the fuselage receiver carries channels 1-8').waitFor(),
  },
  {
    name: 'compare',
    path: () => `/models/${ids.kestrel}/compare`,
    ready: (page) => heading(page, 'What now moves differently'),
  },
  {
    name: 'model-reviews',
    path: () => `/models/${ids.kestrel}/reviews`,
    ready: (page) => page.getByRole('link', { name: 'Revision 12', exact: true }).waitFor(),
  },
  {
    name: 'reviews',
    path: () => `/w/${ids.workspace}/reviews`,
    ready: (page) => page.getByRole('link', { name: 'Kestrel Mk II, revision 12' }).first().waitFor(),
  },
  {
    name: 'review',
    path: () => `/w/${ids.workspace}/reviews/${ids.kestrelReview}`,
    ready: (page) => heading(page, 'Pre-maiden checklist'),
  },
  {
    name: 'shelf',
    path: () => `/w/${ids.workspace}/shelf`,
    ready: (page) => page.getByRole('link', { name: 'Pipit trainer unit' }).waitFor(),
  },
  {
    name: 'shelf-unit',
    path: () => `/w/${ids.workspace}/shelf/${ids.pipit}`,
    ready: (page) => heading(page, 'Settings it holds'),
  },
  {
    name: 'team',
    path: () => `/w/${ids.workspace}/team`,
    ready: (page) => page.getByText('viewer@demo.example').first().waitFor(),
  },
  {
    name: 'field-sheet',
    path: () => `/models/${ids.kestrel}/sheet`,
    ready: (page) => page.getByText('Revision 12, the latest.').waitFor(),
  },
  {
    name: 'outbox',
    path: () => '/outbox',
    ready: (page) => page.getByRole('list', { name: 'Caught messages' }).waitFor(),
  },
  { name: 'account', path: () => '/account', ready: (page) => heading(page, 'Account') },
  { name: 'not-found', path: () => '/no-such-place', ready: (page) => heading(page, 'Page not found') },
];

const visits: Partial<Record<`${ViewportName}-${'in' | 'out'}`, Visit>> = {};

beforeAll(async () => {
  const owner = demoAccount('owner');
  const api = await apiAs(owner);
  ids.workspace = await demoWorkspaceId(api);
  ids.kestrel = (await demoModel(api, 'Kestrel Mk II')).id;
  const reviews = await api.get<{ id: string; state: string }[]>(`/models/${ids.kestrel}/reviews`);
  ids.kestrelReview = reviews.find((review) => review.state === 'open')!.id;
  const shelf = await api.get<{ id: string; label: string }[]>(`/workspaces/${ids.workspace}/receivers`);
  ids.pipit = shelf.find((unit) => unit.label === 'Pipit trainer unit')!.id;
  for (const viewport of ['desktop', 'tablet'] as const) {
    visits[`${viewport}-out`] = await openVisit(browser(), viewport);
    const signedIn = await openVisit(browser(), viewport);
    await signInThroughForm(signedIn.page, owner);
    visits[`${viewport}-in`] = signedIn;
  }
});

afterAll(async () => {
  for (const visit of Object.values(visits)) await visit?.context.close();
});

async function show(screen: Screen, viewport: ViewportName): Promise<{ visit: Visit; problemsBefore: number }> {
  const visit = visits[`${viewport}-${screen.signedOut ? 'out' : 'in'}`]!;
  const problemsBefore = visit.problems.all.length;
  await visit.page.goto(`${baseUrl}${screen.path()}`);
  await screen.ready(visit.page);
  // Fonts decide the layout in the pictures; wait for them like the eye would.
  await visit.page.evaluate(() => document.fonts.ready.then(() => undefined));
  return { visit, problemsBefore };
}

describe('every screen with the demo data', () => {
  it.each(SCREENS.map((screen) => [screen.name, screen] as const))(
    '%s: no serious accessibility finding at 1280 px, fits 768 px',
    async (_name, screen) => {
      const desktop = await show(screen, 'desktop');
      expect(await desktop.visit.page.title()).toMatch(/Bindery$/);
      expect(await seriousA11yViolations(desktop.visit.page)).toEqual([]);
      await saveScreenshot(desktop.visit.page, `screen-${screen.name}-1280`, { fullPage: !screen.windowOnly });

      const tablet = await show(screen, 'tablet');
      const overflow = await tablet.visit.page.evaluate(
        () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
      );
      expect(overflow, 'the page scrolls sideways at 768 px').toBeLessThanOrEqual(0);
      await saveScreenshot(tablet.visit.page, `screen-${screen.name}-768`, { fullPage: !screen.windowOnly });

      for (const { visit, problemsBefore } of [desktop, tablet]) {
        // Signed out is an answer (200, no user), never a failed request; only a page that
        // is not there may log its own 404.
        const allowed: number[] = [];
        expect(
          visit.problems.all
            .slice(problemsBefore)
            .filter((problem) => !allowed.some((status) => problem.includes(`status of ${status}`))),
        ).toEqual([]);
      }
    },
  );
});
