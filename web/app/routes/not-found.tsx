import { Link } from 'react-router-dom';
import { Wordmark } from '../../components/brand/logo-mark';
import { buttonClasses } from '../../components/ui/button';
import { useDocumentTitle } from '../../hooks/use-document-title';

export function NotFoundScreen() {
  useDocumentTitle('Page not found');
  return (
    <main className="flex min-h-screen flex-col items-center px-4 py-20 text-center">
      <Wordmark />
      <p className="mt-12 font-mono text-sm text-ink-700">404</p>
      <h1 className="mt-1 text-2xl font-semibold">Page not found</h1>
      <p className="mt-2 max-w-prose text-base text-ink-700">
        There is no page at this address. It may have moved, or the link was mistyped.
      </p>
      <Link to="/" className={`${buttonClasses('primary')} mt-6 no-underline hover:text-white`}>
        Back to the hangar
      </Link>
    </main>
  );
}
