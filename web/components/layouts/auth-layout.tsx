import type { ReactNode } from 'react';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { Wordmark } from '../brand/logo-mark';
import { Card } from '../ui/card';

/** The frame of the screens before sign-in: the mark, one card, one job. */
export function AuthLayout({ title, intro, children }: { title: string; intro?: string; children: ReactNode }) {
  useDocumentTitle(title);
  return (
    <div className="flex min-h-screen flex-col items-center px-4 py-12 sm:py-20">
      <Wordmark />
      <p className="mt-2 text-sm text-ink-700">The shared record of your multi-receiver setups.</p>
      <Card className="mt-8 w-full max-w-md p-6 sm:p-8">
        <main>
          <h1 className="text-2xl font-semibold tracking-tight">{title}</h1>
          {intro && <p className="mt-1 text-base text-ink-700">{intro}</p>}
          <div className="mt-6">{children}</div>
        </main>
      </Card>
    </div>
  );
}
