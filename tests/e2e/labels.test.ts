import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import jsQR from 'jsqr';
// pdf-parse's package entry runs a self-test when loaded without a parent module; its library file does not.
import pdfParse from 'pdf-parse/lib/pdf-parse.js';
import { PNG } from 'pngjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiAs, demoWorkspaceId } from './support/api';
import { seriousA11yViolations } from './support/axe';
import { openVisit, useBrowser, type Visit } from './support/browser';
import { baseUrl, DEMO_PASSWORD, demoAccount } from './support/demo';
import { saveScreenshot, SCREENSHOT_DIR } from './support/screenshots';
import { expectNoProblems, signInThroughForm } from './support/session';

// Labels for the receivers: each QR code on the printed sheet reads back (with jsQR, a
// general-purpose decoder) as the unit's own address; that address opens the unit,
// through sign-in when needed; the short code finds the unit in the shelf's search;
// and the sheets print one page per sheet of labels.

const browser = useBrowser();
interface Unit {
  id: string;
  label: string;
  short_code: string;
}
let workspace = '';
let units: Unit[] = [];
const visits: Visit[] = [];
const unitAddress = (unit: Unit) => `${baseUrl}/w/${workspace}/shelf/${unit.id}`;

beforeAll(async () => {
  const api = await apiAs(demoAccount('owner'));
  workspace = await demoWorkspaceId(api);
  units = await api.get<Unit[]>(`/workspaces/${workspace}/receivers`);
});

afterAll(async () => {
  for (const visit of visits) await visit.context.close();
});

async function signedInVisit(viewport: 'desktop' | 'phone', deviceScaleFactor = 1): Promise<Visit> {
  const visit = await openVisit(browser(), viewport, { deviceScaleFactor });
  visits.push(visit);
  await signInThroughForm(visit.page, demoAccount('owner'));
  return visit;
}

describe('unit labels', () => {
  it('prints a QR code on each label that reads back as the unit’s address', async () => {
    expect(units.length).toBeGreaterThan(1);
    const visit = await signedInVisit('desktop', 2);
    const { page } = visit;
    await page.goto(`${baseUrl}/w/${workspace}/shelf/labels`);
    await page.getByRole('heading', { name: 'Labels for the shelf' }).waitFor();
    const labels = page.locator('.unit-label');
    await labels.first().waitFor();
    expect(await labels.count()).toBe(units.length);
    await saveScreenshot(page, 'labels-a4');

    for (const unit of units) {
      const label = page.locator(`.unit-label[data-unit="${unit.id}"]`);
      const text = await label.innerText();
      expect(text).toContain(unit.label);
      expect(text).toContain(`${unit.short_code.slice(0, 3)} ${unit.short_code.slice(3)}`);
      const png = PNG.sync.read(await label.locator('svg').screenshot());
      const read = jsQR(new Uint8ClampedArray(png.data), png.width, png.height);
      expect(read?.data).toBe(unitAddress(unit));
    }
    expect(await seriousA11yViolations(page)).toEqual([]);
    expectNoProblems(visit);
  });

  it('prints one page per sheet of labels: A4 3 × 8, US Letter 3 × 10 and one small label each', async () => {
    const visit = await signedInVisit('desktop');
    const { page } = visit;
    mkdirSync(SCREENSHOT_DIR, { recursive: true });
    // 23 places used on the A4 sheet: the first unit takes the last place, the rest a second sheet.
    for (const [sheet, query, pages] of [
      ['a4-3x8', '&skip=23', 2],
      ['letter-3x10', '', 1],
      ['single', '', units.length],
    ] as const) {
      await page.goto(`${baseUrl}/w/${workspace}/shelf/labels?sheet=${sheet}${query}`);
      await page.locator('.unit-label').first().waitFor();
      await page.emulateMedia({ media: 'print' });
      const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true });
      await page.emulateMedia({ media: 'screen' });
      writeFileSync(path.join(SCREENSHOT_DIR, `labels-${sheet}.pdf`), pdf);
      const parsed = await pdfParse(pdf);
      expect(parsed.numpages, sheet).toBe(pages);
      // A long label wraps onto a second line of its sticker.
      const text = parsed.text.replace(/\s+/g, ' ');
      for (const unit of units) expect(text).toContain(unit.label);
      // The app's navigation stays off the paper.
      expect(text).not.toContain('Sign out');
      expect(text).not.toContain('Print labels');
    }
    expectNoProblems(visit);
  });

  it('opens the unit from its address after sign-in, on a phone', async () => {
    const unit = units[0];
    const visit = await openVisit(browser(), 'phone');
    visits.push(visit);
    const { page } = visit;
    await page.goto(unitAddress(unit));
    await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    await page.getByLabel('E-mail').fill(demoAccount('viewer').email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: unit.label, exact: true }).waitFor();
    expect(new URL(page.url()).pathname).toBe(`/w/${workspace}/shelf/${unit.id}`);
    await page.getByRole('heading', { name: 'Settings it holds' }).waitFor();
    expect(await page.getByText(unit.short_code).count()).toBeGreaterThan(0);
    expectNoProblems(visit);
  });

  it('finds a unit by the short code typed into the shelf’s search', async () => {
    const unit = units[units.length - 1];
    const { page } = await signedInVisit('phone');
    await page.goto(`${baseUrl}/w/${workspace}/shelf`);
    await page.getByRole('link', { name: unit.label }).waitFor();
    await page
      .getByLabel('Search receivers')
      .fill(`${unit.short_code.slice(0, 3).toLowerCase()} ${unit.short_code.slice(3)}`);
    await page.getByText('1 receiver match').waitFor();
    await page.getByRole('link', { name: unit.label }).click();
    await page.getByRole('heading', { name: unit.label, exact: true }).waitFor();
  });
});
