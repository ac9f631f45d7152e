import { useEffect, type ComponentPropsWithoutRef } from 'react';
import Markdown, { type Components } from 'react-markdown';
import { useLocation } from 'react-router-dom';
import remarkGfm from 'remark-gfm';
import { PageHeader } from '../../../components/ui/page-header';
import { formatText } from '../format-text';

/** A heading's anchor: lower-case words joined by dashes, as the contents list links to it. */
export function headingAnchor(text: string): string {
  return text
    .toLowerCase()
    .replace(/[`*_]/g, '')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
}

function textOf(children: unknown): string {
  if (typeof children === 'string' || typeof children === 'number') return String(children);
  if (Array.isArray(children)) return children.map(textOf).join('');
  if (children && typeof children === 'object' && 'props' in children)
    return textOf((children as { props: { children?: unknown } }).props.children);
  return '';
}

// The document's own first heading is the page title; the rest keep their levels one
// step down so the page has a single h1.
const [, ...rest] = formatText.split('\n');
const body = rest.join('\n');
const sections = [...body.matchAll(/^## (.+)$/gm)].map((match) => match[1].replace(/[`*]/g, ''));

const heading =
  (Level: 'h2' | 'h3' | 'h4') =>
  ({ children }: ComponentPropsWithoutRef<'h2'>) => {
    const id = headingAnchor(textOf(children));
    const size = Level === 'h2' ? 'mt-10 text-xl' : Level === 'h3' ? 'mt-6 text-lg' : 'mt-4 text-base';
    return (
      <Level id={id} className={`${size} scroll-mt-4 font-semibold text-ink-900`}>
        {children}
      </Level>
    );
  };

const components: Components = {
  h1: heading('h2'),
  h2: heading('h2'),
  h3: heading('h3'),
  h4: heading('h4'),
  p: ({ children }) => <p className="mt-3 max-w-prose text-base text-ink-900">{children}</p>,
  ul: ({ children }) => <ul className="mt-3 max-w-prose list-disc space-y-1 pl-6">{children}</ul>,
  ol: ({ children }) => <ol className="mt-3 max-w-prose list-decimal space-y-1 pl-6">{children}</ol>,
  // A long line scrolls inside its block; the block is a tab stop so the keyboard can scroll it.
  pre: ({ children }) => (
    <pre
      tabIndex={0}
      className="mt-3 overflow-x-auto rounded-lg border border-ply-200 bg-paper-raised p-3 font-mono text-sm"
    >
      {children}
    </pre>
  ),
  code: ({ children }) => <code className="font-mono text-[0.92em]">{children}</code>,
  table: ({ children }) => (
    // A wide table scrolls on its own; the region is a tab stop so the keyboard can scroll it too.
    <div
      className="mt-3 overflow-x-auto rounded-lg border border-ply-200"
      tabIndex={0}
      role="region"
      aria-label="Table"
    >
      <table className="w-full border-collapse text-left text-sm">{children}</table>
    </div>
  ),
  th: ({ children }) => <th className="border-b border-ply-300 bg-paper px-2 py-1.5 font-medium">{children}</th>,
  td: ({ children }) => <td className="border-b border-ply-100 px-2 py-1.5 align-top">{children}</td>,
  a: ({ href, children }) => {
    // Links to other repository files have no page in the app: they are shown as text.
    if (!href || !/^(#|https?:)/.test(href)) return <span>{children}</span>;
    return (
      <a href={href} {...(href.startsWith('#') ? {} : { rel: 'noreferrer', target: '_blank' })}>
        {children}
      </a>
    );
  },
};

/** The setup format's reference, generated from docs/format.md. */
export function FormatReferenceScreen() {
  const { hash } = useLocation();
  useEffect(() => {
    if (hash) document.getElementById(decodeURIComponent(hash.slice(1)))?.scrollIntoView();
  }, [hash]);

  return (
    <>
      <PageHeader
        title="The setup format"
        description="What a setup file holds, field by field, with the checks Bindery runs on it. This is the project's own format reference (docs/format.md), shown as it is."
      />
      <div className="grid gap-8 lg:grid-cols-[14rem_minmax(0,1fr)]">
        <nav aria-label="Contents" className="text-sm lg:sticky lg:top-4 lg:self-start">
          <p className="font-semibold text-ink-900">Contents</p>
          <ul className="mt-2 space-y-1">
            {sections.map((section) => (
              <li key={section}>
                <a href={`#${headingAnchor(section)}`}>{section}</a>
              </li>
            ))}
          </ul>
        </nav>
        <article className="min-w-0 text-ink-900">
          <Markdown remarkPlugins={[remarkGfm]} components={components}>
            {body}
          </Markdown>
        </article>
      </div>
    </>
  );
}
