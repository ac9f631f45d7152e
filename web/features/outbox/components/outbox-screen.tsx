import { useState } from 'react';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { isApiError } from '../../../lib/api-client';
import { cx } from '../../../lib/cx';
import { TimeAgo } from '../../models/components/time-ago';
import { useOutbox } from '../api/get-outbox';
import type { OutboxMessage } from '../types';
import { LinkedText } from './linked-text';

const DESCRIPTION =
  'The mail Bindery sent to your own address while it runs with its own local mail server: invitations, password resets, review requests and verdicts. Newest first.';

// Mail links are credentials (a reset link takes over an account), so the server lists
// only the signed-in account's own mail; the screen says so, so nobody looks for more.
const OWN_MAIL_ONLY =
  'A development convenience standing in for your inbox: it shows only mail addressed to the account you are signed in with, never anyone else’s. To read mail sent to another address, sign in as that account.';

export function OutboxScreen() {
  const outbox = useOutbox();
  const [openId, setOpenId] = useState<string | null>(null);

  let body;
  if (outbox.isPending) body = <LoadingState label="Loading the outbox…" />;
  else if (outbox.isError) {
    body =
      isApiError(outbox.error) && outbox.error.status === 404 ? (
        <EmptyState title="No outbox on this server">
          This Bindery sends mail through a real mail server (SMTP_HOST is set), so there is no local catch to show. The
          Outbox is there in development and in the demo.
        </EmptyState>
      ) : (
        <ErrorState title="The outbox could not be loaded" error={outbox.error} onRetry={() => void outbox.refetch()} />
      );
  } else if (outbox.data.messages.length === 0) {
    body = (
      <EmptyState title="No mail yet">
        Mail sent to your address shows up here: an invitation, a password reset, a review request or a verdict.
      </EmptyState>
    );
  } else {
    const selected = outbox.data.messages.find((message) => message.id === openId) ?? outbox.data.messages[0];
    body = (
      <div className="grid gap-4 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
        <Card className="overflow-hidden">
          <ul aria-label="Caught messages" className="max-h-[70vh] divide-y divide-ply-100 overflow-y-auto">
            {outbox.data.messages.map((message) => (
              <li key={message.id}>
                <button
                  type="button"
                  onClick={() => setOpenId(message.id)}
                  aria-current={message.id === selected.id ? 'true' : undefined}
                  className={cx(
                    'block w-full px-4 py-3 text-left hover:bg-ply-100',
                    message.id === selected.id && 'border-l-[3px] border-accent-700 bg-accent-50',
                  )}
                >
                  <span className="block truncate font-medium text-ink-900">{message.subject || '(no subject)'}</span>
                  <span className="mt-0.5 flex items-baseline justify-between gap-2 text-sm text-ink-700">
                    <span className="truncate font-mono">{message.to.join(', ')}</span>
                    <TimeAgo iso={message.received_at} className="shrink-0 text-ink-500" />
                  </span>
                </button>
              </li>
            ))}
          </ul>
          {outbox.data.total > outbox.data.messages.length && (
            <p className="border-t border-ply-200 px-4 py-2 text-sm text-ink-700">
              The newest {outbox.data.messages.length} of {outbox.data.total}.
            </p>
          )}
        </Card>
        <MessageView message={selected} />
      </div>
    );
  }

  return (
    <>
      <PageHeader
        title="Outbox"
        description={DESCRIPTION}
        actions={
          <Button
            variant="secondary"
            size="sm"
            pending={outbox.isFetching && !outbox.isPending}
            onClick={() => void outbox.refetch()}
          >
            Check for new mail
          </Button>
        }
      />
      <p className="mb-4 rounded-md border border-ply-200 bg-ply-100 px-3 py-2 text-sm text-ink-700">{OWN_MAIL_ONLY}</p>
      {body}
    </>
  );
}

function MessageView({ message }: { message: OutboxMessage }) {
  return (
    <Card className="min-w-0 p-5" aria-labelledby="outbox-subject">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h2 id="outbox-subject" className="text-lg font-semibold text-ink-900">
          {message.subject || '(no subject)'}
        </h2>
        <Badge tone="info">Development only</Badge>
      </div>
      <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
        <dt className="text-ink-500">To</dt>
        <dd className="font-mono break-all text-ink-900">{message.to.join(', ')}</dd>
        <dt className="text-ink-500">From</dt>
        <dd className="break-all text-ink-900">{message.from}</dd>
        <dt className="text-ink-500">Received</dt>
        <dd className="text-ink-900">
          <TimeAgo iso={message.received_at} />
        </dd>
      </dl>
      {message.links.length > 0 && (
        <div className="mt-4 rounded-md border border-accent-700/30 bg-accent-50 px-3 py-2">
          <p className="text-sm font-medium text-ink-900">
            {message.links.length === 1 ? 'Link in this mail' : 'Links in this mail'}
          </p>
          <ul className="mt-1 space-y-1">
            {message.links.map((link) => (
              <li key={link}>
                <a href={link} className="font-mono text-sm break-all">
                  {link}
                </a>
              </li>
            ))}
          </ul>
        </div>
      )}
      <pre className="mt-4 font-sans text-base whitespace-pre-wrap text-ink-900">
        <LinkedText text={message.text} />
      </pre>
    </Card>
  );
}
