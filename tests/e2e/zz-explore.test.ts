import { afterAll, beforeAll, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { signedIn } from './support/session';
import { apiAs, demoModel, demoWorkspaceId } from './support/api';
import { baseUrl, demoAccount } from './support/demo';
import { seriousA11yViolations } from './support/axe';

let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); });
afterAll(async () => { await browser?.close(); });

it('explores', async () => {
  const owner = demoAccount('owner');
  const api = await apiAs(owner);
  const ws = await demoWorkspaceId(api);
  const kestrel = await demoModel(api, 'Kestrel Mk II');
  const shelf = await api.get<{ id: string }[]>(`/workspaces/${ws}/receivers`);
  const paths = [`/w/${ws}/hangar`, `/w/${ws}/shelf`, `/w/${ws}/shelf/${shelf[0].id}`, `/w/${ws}/reviews`, `/w/${ws}/team`,
    ...['overview','edit','bench','history','compare','reviews','sheet'].map((s) => `/models/${kestrel.id}/${s}`), '/outbox', '/nowhere'];
  for (const vp of ['desktop', 'tablet'] as const) {
    const visit = await signedIn(browser, owner, vp);
    for (const p of paths) {
      await visit.page.goto(baseUrl + p);
      await visit.page.waitForLoadState('networkidle');
      await visit.page.waitForTimeout(800);
      const name = `/tmp/e2e-explore/${vp}-${p.replace(/[^a-z]+/g, '-').replace(/-[0-9a-f-]{30,}/g, '')}.png`;
      await visit.page.screenshot({ path: name, fullPage: true });
      if (vp === 'desktop') console.log(p, await visit.page.title(), JSON.stringify(await seriousA11yViolations(visit.page)));
    }
    console.log(vp, JSON.stringify(visit.problems.all, null, 1));
    await visit.context.close();
  }
  const v = await (await import('./support/browser')).openVisit(browser);
  for (const p of ['/sign-in', '/create-account', '/reset-password']) {
    await v.page.goto(baseUrl + p); await v.page.waitForLoadState('networkidle');
    await v.page.screenshot({ path: `/tmp/e2e-explore/anon-${p.slice(1)}.png`, fullPage: true });
    console.log(p, JSON.stringify(await seriousA11yViolations(v.page)));
  }
  // addScriptTag check
  try { await v.page.addScriptTag({ path: (await import('./support/axe')).AXE_PATH }); console.log('addScriptTag ok', await v.page.evaluate(() => typeof (window as any).axe)); } catch (e) { console.log('addScriptTag failed', String(e).slice(0, 300)); }
  console.log('anon', JSON.stringify(v.problems.all, null, 1));
}, 300_000);
