import { useOnline, useSavedCopies } from '../../hooks/use-offline';

const when = (iso: string) =>
  new Date(iso).toLocaleString(undefined, { day: 'numeric', month: 'long', hour: '2-digit', minute: '2-digit' });

/**
 * Says plainly when the screens show copies saved on this device rather than the
 * server's answers, and from when (the oldest copy on show), and that changes wait for
 * the network. Hidden online with fresh answers.
 */
export function OfflineBanner() {
  const online = useOnline();
  const copies = useSavedCopies();
  if (online && copies.size === 0) return null;
  const oldest = [...copies.values()].sort()[0];
  return (
    <div role="status" className="border-b-2 border-caution-700 bg-caution-100 text-caution-700 print:hidden">
      <p className="mx-auto max-w-6xl px-4 py-2 text-sm sm:px-6">
        <strong className="font-semibold">{online ? 'The server cannot be reached.' : 'No signal.'}</strong>{' '}
        {oldest
          ? `You are reading what this device saved on ${when(oldest)}; it may have changed since.`
          : 'Screens you opened while online can still be read here.'}{' '}
        Saving, installing, reviewing and other changes need the network; what you type stays on the screen.
      </p>
    </div>
  );
}
