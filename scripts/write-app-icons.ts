import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { chromium } from 'playwright-core';
import { CHROMIUM_PATH } from './lib/chromium-path';
import { projectRoot } from './lib/paths';

// Draws the installed app's PNG icons from Bindery's own mark (public/favicon.svg, and
// a full-bleed drawing whose mark sits inside the safe circle that phones crop to).
// Run again after changing either drawing: `npx tsx scripts/write-app-icons.ts`.

const ICONS = [
  { source: 'public/favicon.svg', size: 192, out: 'public/icons/app-icon-192.png' },
  { source: 'public/favicon.svg', size: 512, out: 'public/icons/app-icon-512.png' },
  { source: 'public/icons/app-icon-maskable.svg', size: 512, out: 'public/icons/app-icon-maskable-512.png' },
  { source: 'public/icons/app-icon-maskable.svg', size: 180, out: 'public/icons/apple-touch-icon-180.png' },
];

const browser = await chromium.launch({ executablePath: CHROMIUM_PATH, args: ['--headless', '--no-sandbox'] });
try {
  const page = await browser.newPage();
  for (const icon of ICONS) {
    const svg = readFileSync(path.join(projectRoot, icon.source), 'utf8');
    await page.setViewportSize({ width: icon.size, height: icon.size });
    await page.setContent(
      `<style>html,body{margin:0;background:transparent}svg{display:block;width:${icon.size}px;height:${icon.size}px}</style>${svg}`,
    );
    writeFileSync(path.join(projectRoot, icon.out), await page.screenshot({ omitBackground: true }));
    console.log(`${icon.out} (${icon.size} px)`);
  }
} finally {
  await browser.close();
}
