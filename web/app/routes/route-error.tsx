import { useRouteError } from 'react-router-dom';
import { Wordmark } from '../../components/brand/logo-mark';
import { ErrorState } from '../../components/ui/error-state';
import { useDocumentTitle } from '../../hooks/use-document-title';

/** The last stop for an error no screen handled, e.g. a part of the app that failed to download after a deploy. */
export function RouteErrorScreen() {
  const error = useRouteError();
  useDocumentTitle('Something went wrong');
  return (
    <main className="mx-auto flex min-h-screen max-w-xl flex-col items-center px-4 py-20">
      <Wordmark />
      <div className="mt-10 w-full">
        <ErrorState title="Something went wrong" error={error} onRetry={() => window.location.reload()} />
      </div>
    </main>
  );
}
