import { describe, expect, it } from 'vitest';
import { seriousA11yViolations } from './support/axe';
import { openVisit, useBrowser } from './support/browser';
import { baseUrl } from './support/demo';

const browser = useBrowser();

// The journeys' "no console errors, no CSP violations" rests on this watcher; here it is
// shown to see what it must see.
describe('the browser watcher of the journeys', () => {
  it('records console errors, uncaught errors, refused inline scripts and dialogs on every tab', async () => {
    const visit = await openVisit(browser());
    await visit.page.goto(`${baseUrl}/sign-in`);
    await visit.page.getByRole('button', { name: 'Sign in' }).waitFor();
    expect(visit.problems.unexpected([])).toEqual([]);

    await visit.page.evaluate(() => console.error('a console error'));
    await visit.page.evaluate(() => {
      setTimeout(() => {
        throw new Error('an uncaught error');
      });
    });
    await visit.page.evaluate(() => {
      const script = document.createElement('script');
      script.textContent = 'document.title = "ran inline"';
      document.body.append(script);
    });
    const second = await visit.newTab();
    await second.goto(`${baseUrl}/sign-in`);
    await second.evaluate(() => setTimeout(() => alert('a dialog')));

    await expect.poll(() => visit.problems.csp.length).toBeGreaterThan(0);
    await expect
      .poll(() => visit.problems.all.some((problem) => problem.includes('unexpected alert dialog: a dialog')))
      .toBe(true);
    const seen = visit.problems.unexpected([401]).join('\n');
    expect(seen).toContain('a console error');
    expect(seen).toContain('page error: an uncaught error');
    expect(visit.problems.csp[0]).toMatch(/^CSP: script-src-elem blocked inline on \/sign-in/);
    expect(await visit.page.title()).not.toBe('ran inline');
    await visit.context.close();
  });

  it('has axe report a field without a label as a critical finding', async () => {
    const visit = await openVisit(browser());
    await visit.page.goto(`${baseUrl}/sign-in`);
    await visit.page.getByRole('button', { name: 'Sign in' }).waitFor();
    expect(await seriousA11yViolations(visit.page)).toEqual([]);
    await visit.page.evaluate(() =>
      document.querySelector('main, form')?.append(Object.assign(document.createElement('input'), { type: 'text' })),
    );
    const found = await seriousA11yViolations(visit.page);
    expect(found.some((line) => line.startsWith('critical label:'))).toBe(true);
    // axe ran from the DevTools protocol, so the page's policy saw no script of ours.
    expect(visit.problems.csp).toEqual([]);
    await visit.context.close();
  });
});
