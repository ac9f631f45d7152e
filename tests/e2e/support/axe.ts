import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';

const require = createRequire(import.meta.url);
export const AXE_PATH = require.resolve('axe-core/axe.min.js');
let axeSource: string | null = null;

interface AxeViolation {
  id: string;
  impact: 'minor' | 'moderate' | 'serious' | 'critical' | null;
  help: string;
  nodes: { target: unknown[]; failureSummary?: string }[];
}

/**
 * Runs axe-core in the page and answers its serious and critical violations, one line
 * each. The app's CSP (script-src 'self') refuses an injected <script> element, so
 * axe's source is evaluated through the DevTools protocol instead, which the page's
 * policy does not govern.
 */
export async function seriousA11yViolations(page: Page): Promise<string[]> {
  axeSource ??= readFileSync(AXE_PATH, 'utf8');
  const present = await page.evaluate(() => typeof (window as unknown as { axe?: unknown }).axe === 'object');
  if (!present) await page.evaluate(axeSource);
  const violations = await page.evaluate(async () => {
    const axe = (
      window as unknown as { axe: { run(context: Document, options: object): Promise<{ violations: AxeViolation[] }> } }
    ).axe;
    const result = await axe.run(document, {
      resultTypes: ['violations'],
      runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'] },
    });
    return result.violations;
  });
  return violations
    .filter((violation) => violation.impact === 'serious' || violation.impact === 'critical')
    .map(
      (violation) =>
        `${violation.impact} ${violation.id}: ${violation.help} at ${violation.nodes
          .map((node) => JSON.stringify(node.target))
          .slice(0, 5)
          .join(', ')}`,
    );
}
