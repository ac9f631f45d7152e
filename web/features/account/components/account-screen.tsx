import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { PageHeader } from '../../../components/ui/page-header';
import { useToast } from '../../../components/ui/toast';
import { useSession } from '../../auth/hooks/use-session';
import { useSignOutEverywhere } from '../api/sign-out-everywhere';
import { ChangePasswordForm } from './change-password-form';

/** The signed-in pilot's own account: the password, and ending every session at once. */
export function AccountScreen() {
  const { user } = useSession();
  const signOutEverywhere = useSignOutEverywhere();
  const toast = useToast();

  return (
    <>
      <PageHeader
        title="Account"
        description={
          <>
            Signed in as <span className="font-medium text-ink-900">{user.name}</span> ({user.email}).
          </>
        }
      />
      <div className="grid gap-6 lg:grid-cols-2">
        <Card className="p-5">
          <h2 className="mb-1 text-lg font-semibold text-ink-900">Password</h2>
          <p className="mb-4 text-sm text-ink-700">
            Changing it signs this account out everywhere else; this browser stays signed in.
          </p>
          <ChangePasswordForm />
        </Card>
        <Card className="p-5">
          <h2 className="mb-1 text-lg font-semibold text-ink-900">Sessions</h2>
          <p className="mb-4 text-sm text-ink-700">
            Lost a tablet at the field, or signed in on a club computer? End every session of this account, this one
            included.
          </p>
          <Button
            variant="secondary"
            pending={signOutEverywhere.isPending}
            onClick={() =>
              signOutEverywhere.mutate(undefined, {
                onError: (error) =>
                  toast({ title: 'Could not sign out everywhere', description: error.message, tone: 'error' }),
              })
            }
          >
            Sign out everywhere
          </Button>
        </Card>
      </div>
    </>
  );
}
