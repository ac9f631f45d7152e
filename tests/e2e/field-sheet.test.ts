import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import pdfParse from 'pdf-parse/lib/pdf-parse.js';
import { describe, expect, it } from 'vitest';
import { apiAs, demoModel } from './support/api';
import { useBrowser } from './support/browser';
import { baseUrl, demoAccount } from './support/demo';
import { saveScreenshot, SCREENSHOT_DIR } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';

const browser = useBrowser();

describe('journey: print the field sheet and download its PDF', () => {
  it('prints only the sheet of the Kestrel’s latest revision and downloads the PDF with its pin tables', async () => {
    const viewer = demoAccount('viewer');
    const kestrel = await demoModel(await apiAs(viewer), 'Kestrel Mk II');
    const visit = await signedIn(browser(), viewer);
    const { page } = visit;
    await page.goto(`${baseUrl}/models/${kestrel.id}/overview`);
    await page.getByRole('navigation', { name: 'Model' }).getByRole('link', { name: 'Field sheet' }).click();
    await page.getByText('Revision 12, the latest.').waitFor();
    await page.getByText('Bindery field sheet', { exact: false }).first().waitFor();

    // The Print button hands the page to the browser's print dialog; headless there is
    // none, so the call is counted and the printout itself made with print media below.
    await page.evaluate(() => {
      const counted = window as unknown as { printCalls: number };
      counted.printCalls = 0;
      window.print = () => {
        counted.printCalls += 1;
      };
    });
    await page.getByRole('button', { name: 'Print' }).click();
    expect(await page.evaluate(() => (window as unknown as { printCalls: number }).printCalls)).toBe(1);

    await page.emulateMedia({ media: 'print' });
    expect(await page.getByRole('button', { name: 'Sign out' }).isVisible()).toBe(false);
    expect(await page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false);
    expect(await page.getByRole('heading', { name: 'Kestrel Mk II', exact: true }).isVisible()).toBe(true);
    await saveScreenshot(page, 'journey-10-field-sheet-print-media');
    const printout = await page.pdf({ format: 'A4', preferCSSPageSize: true, printBackground: true });
    mkdirSync(SCREENSHOT_DIR, { recursive: true });
    writeFileSync(path.join(SCREENSHOT_DIR, 'journey-10-field-sheet-print.pdf'), printout);
    const printed = await pdfParse(printout);
    expect(printed.text).toContain('Kestrel Mk II');
    expect(printed.text).toContain('Channel plan');
    // A PDF's text may carry the micro sign (U+00B5) as the Greek mu (U+03BC): either reads µs.
    expect(printed.text).toMatch(/1\s*9\s*tailwheel\s*1500 [µμ]s/);
    expect(printed.text).not.toContain('Sign out');
    expect(printed.text).not.toContain('Download PDF');
    expect(printed.text).not.toContain('Keep for the field');
    expect(printed.text).not.toContain('No signal');
    await page.emulateMedia({ media: 'screen' });

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: 'Download PDF' }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(/^kestrel-mk-ii.*-r12-field-sheet\.pdf$/);
    const bytes = readFileSync(await download.path());
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const pdf = await pdfParse(bytes);
    expect(pdf.numpages).toBe(1);
    expect(pdf.text).toContain('Kestrel Mk II');
    // Wing pins 1-8 carry channels 9-16 (the demo's remap); the tailwheel's pin centres on failsafe.
    expect(pdf.text).toMatch(/1\s*9\s*tailwheel\s*1500 [µμ]s/);
    expect(pdf.text).toMatch(/3\s*3\s*motor\s*1000 [µμ]s/);
    await saveScreenshot(page, 'journey-10-field-sheet');
    expectNoProblems(visit);
    await visit.context.close();
  });
});
