import type { Page } from 'playwright-core';

/** WCAG 2.5.5's size for a target a thumb can hit, in CSS pixels. */
export const TOUCH_TARGET_PX = 44;

/**
 * The controls on the page smaller than a thumb's target, one line each: buttons,
 * fields, selects, navigation links and links drawn as buttons. A check box or a
 * radio button counts by the label wrapped round it, which is what the thumb presses;
 * links inside running text are exempt, as WCAG exempts them.
 */
export function smallTouchTargets(page: Page): Promise<string[]> {
  return page.evaluate((minimum) => {
    const selector = [
      'button',
      'select',
      'textarea',
      'input:not([type=hidden])',
      '[role=tab]',
      'nav a',
      'a.inline-flex',
      'summary',
    ].join(',');
    const small: string[] = [];
    for (const element of document.querySelectorAll<HTMLElement>(selector)) {
      const target =
        element instanceof HTMLInputElement && (element.type === 'checkbox' || element.type === 'radio')
          ? (element.closest('label') ?? element)
          : element;
      const box = target.getBoundingClientRect();
      const style = getComputedStyle(target);
      if (box.width === 0 || box.height === 0 || style.visibility === 'hidden') continue;
      // The editor's hidden text areas and other off-screen helpers are not for the thumb.
      if (target.closest('.cm-editor, .sr-only, [aria-hidden=true]') && target === element) continue;
      if (box.width + 0.5 < minimum || box.height + 0.5 < minimum) {
        const name = (target.getAttribute('aria-label') ?? target.textContent ?? '').trim().slice(0, 40);
        small.push(`${target.tagName.toLowerCase()} "${name}" ${Math.round(box.width)}×${Math.round(box.height)}`);
      }
    }
    return small;
  }, TOUCH_TARGET_PX);
}

/** The outermost elements that reach past the window's right edge, to name in a failed fit. */
export function elementsPastTheEdge(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const edge = document.documentElement.clientWidth;
    const past: string[] = [];
    for (const element of document.querySelectorAll<HTMLElement>('body *')) {
      const box = element.getBoundingClientRect();
      if (box.right <= edge + 0.5 || box.width === 0) continue;
      const parent = element.parentElement?.getBoundingClientRect();
      if (parent && parent.right > edge + 0.5) continue;
      past.push(`${element.tagName.toLowerCase()}.${element.className} ${Math.round(box.right)}`.slice(0, 160));
    }
    return past;
  });
}
