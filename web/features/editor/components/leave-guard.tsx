import { useEffect, useState } from 'react';
import { useBlocker, useLocation } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';

/**
 * Asks before the pilot leaves the editor with unsaved changes: on a link inside the
 * app with a dialog, on closing or reloading the tab with the browser's own question.
 * Moving within the editor (a finding's `?line=`) is not leaving.
 */
export function LeaveGuard({ dirty }: { dirty: boolean }) {
  // Only a move away from the editor's own address counts. While a lazy screen loads,
  // React may keep the editor mounted out of sight behind it; its guard must not then
  // stop moves that start elsewhere.
  const { pathname } = useLocation();
  const [home] = useState(pathname);
  const blocker = useBlocker(
    ({ currentLocation, nextLocation }) => dirty && currentLocation.pathname === home && nextLocation.pathname !== home,
  );

  useEffect(() => {
    if (!dirty) return;
    const onBeforeUnload = (event: BeforeUnloadEvent) => {
      event.preventDefault();
      // Older browsers ask only when returnValue is set.
      event.returnValue = '';
    };
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => window.removeEventListener('beforeunload', onBeforeUnload);
  }, [dirty]);

  useEffect(() => {
    if (blocker.state === 'blocked' && !dirty) blocker.proceed?.();
  }, [blocker, dirty]);

  if (blocker.state !== 'blocked') return null;
  return (
    <Dialog title="Leave with unsaved changes?" onClose={() => blocker.reset?.()}>
      <p className="text-base text-ink-700">
        Your changes are not a revision yet. They stay in this browser tab as a draft and come back when you open the
        editor again, but they are lost when the tab is closed. Save them as a revision to keep them for good.
      </p>
      <div className="mt-4 flex flex-wrap justify-end gap-2">
        <Button variant="secondary" onClick={() => blocker.proceed?.()}>
          Leave
        </Button>
        <Button onClick={() => blocker.reset?.()} data-autofocus>
          Stay and keep editing
        </Button>
      </div>
    </Dialog>
  );
}
