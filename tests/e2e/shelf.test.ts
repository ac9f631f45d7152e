import { describe, expect, it } from 'vitest';
import { useBrowser } from './support/browser';
import { demoAccount } from './support/demo';
import { saveScreenshot } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';

const browser = useBrowser();

describe('journey: a receiver from the Shelf into an airframe, through the reuse check', () => {
  it('installs the Pipit trainer unit in the Kestrel’s wing slot, works through the settings to change and records them', async () => {
    const visit = await signedIn(browser(), demoAccount('editor'));
    const { page } = visit;
    await page.getByRole('navigation', { name: 'Workspace' }).getByRole('link', { name: 'Shelf' }).click();
    await page.getByRole('heading', { name: 'Shelf', exact: true }).waitFor();
    await page.getByRole('link', { name: 'Pipit trainer unit' }).click();
    await page.getByRole('heading', { name: 'Pipit trainer unit', exact: true }).waitFor();
    await page.getByText('Free, on the shelf.').waitFor();

    await page.getByRole('button', { name: 'Install into a model' }).click();
    await page.getByLabel('Model').selectOption({ label: 'Kestrel Mk II' });
    const slot = page.getByLabel('As which receiver of the setup');
    await slot.locator('option', { hasText: /^wing/ }).waitFor({ state: 'attached' });
    await slot.selectOption({ index: 2 });
    expect(await slot.evaluate((select: HTMLSelectElement) => select.selectedOptions[0]?.textContent ?? '')).toMatch(
      /^wing\b/,
    );

    // The unit left a trainer with pins 1-8 on channels 1-8, telemetry on and pin 3 failing
    // safe to 988 µs (fixtures/reuse/trainer-unit.yaml); the wing slot carries 9-16 silently
    // with hold on pins 2-6. So: 8 remaps, failsafes on pins 2, 3, 4 and 6, telemetry off.
    await page.getByText('13 settings to change on the unit').waitFor();
    await page.getByText('What would have to change on the unit').waitFor();
    await saveScreenshot(page, 'journey-09-reuse-preview');
    await page.getByRole('button', { name: 'Install it here' }).click();
    await page
      .getByRole('region', { name: 'Notifications' })
      .getByText('Pipit trainer unit is now receiver wing of Kestrel Mk II')
      .waitFor();

    const bench = page.getByRole('group', { name: 'Program these on the unit' });
    const ticks = bench.getByRole('checkbox');
    await ticks.first().waitFor();
    expect(await ticks.count()).toBe(13);
    const apply = page.getByRole('button', { name: 'I have applied these settings' });
    expect(await apply.isDisabled()).toBe(true);
    for (const tick of await ticks.all()) await tick.check();
    // The safety changes come first; the re-bind step closes the list.
    await bench.getByRole('heading', { name: 'Safety first' }).waitFor();
    expect(await apply.isDisabled()).toBe(true);
    await page.getByRole('checkbox', { name: /Bind the unit to this model/ }).check();
    await saveScreenshot(page, 'journey-09-reuse-ticked');
    await apply.click();
    await page.getByRole('region', { name: 'Notifications' }).getByText('Settings recorded').waitFor();
    await page.getByText('Ready: nothing to change on the unit').waitFor();
    await saveScreenshot(page, 'journey-09-reuse-ready');

    await page.getByRole('navigation', { name: 'Breadcrumb' }).getByRole('link', { name: 'Shelf' }).click();
    const row = page.getByRole('row').filter({ hasText: 'Pipit trainer unit' });
    await row.getByText('Kestrel Mk II').waitFor();
    await row.getByText('Ready').waitFor();
    expectNoProblems(visit);
    await visit.context.close();
  });
});
