import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { CautionsPanel } from '../../web/features/cautions/components/cautions-panel';

export interface CautionText {
  title: string;
  body: string;
}

export interface CautionsText {
  heading: string;
  items: CautionText[];
}

const ENTITIES: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', '#x27': "'", '#39': "'", nbsp: '\u00a0' };
const plain = (html: string) => html.replace(/<[^>]*>/g, '').replace(/&(#x27|#39|amp|lt|gt|quot|nbsp);/g, (_, name: string) => ENTITIES[name]).trim();

let cached: CautionsText | null = null;

/**
 * The cautions as the panel on screen words them. The panel (web/features/cautions) is
 * the one place they are written; the PDF reads them from its markup, so the printed
 * sheet and the screen cannot drift apart.
 */
export function cautionsText(): CautionsText {
  if (cached) return cached;
  const html = renderToStaticMarkup(createElement(CautionsPanel));
  const heading = plain(/<h[23][^>]*>([\s\S]*?)<\/h[23]>/.exec(html)?.[1] ?? '');
  const items = [...html.matchAll(/<li[^>]*>([\s\S]*?)<\/li>/g)].map((item) => {
    const [title = '', body = ''] = [...item[1].matchAll(/<p[^>]*>([\s\S]*?)<\/p>/g)].map((p) => plain(p[1]));
    return { title, body };
  });
  if (!heading || items.length === 0 || items.some((item) => !item.title)) throw new Error('The cautions panel no longer reads as a heading and a list of titled items.');
  cached = { heading, items };
  return cached;
}
