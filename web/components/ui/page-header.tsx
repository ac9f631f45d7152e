import type { ReactNode } from 'react';
import { useDocumentTitle } from '../../hooks/use-document-title';

export interface PageHeaderProps {
  title: string;
  /** One line under the title saying what this screen is for. */
  description?: ReactNode;
  /** Buttons or links for the screen's main actions. */
  actions?: ReactNode;
  /** The browser tab title when it should differ from the heading. */
  documentTitle?: string;
}

/** A screen's heading; it also names the browser tab so every screen has a title. */
export function PageHeader({ title, description, actions, documentTitle }: PageHeaderProps) {
  useDocumentTitle(documentTitle ?? title);
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-ply-200 pb-4">
      <div className="min-w-0">
        <h1 className="text-2xl font-semibold tracking-tight text-ink-900">{title}</h1>
        {description && <p className="mt-1 max-w-prose text-base text-ink-700">{description}</p>}
      </div>
      {actions && <div className="flex flex-wrap items-center gap-2">{actions}</div>}
    </div>
  );
}
