import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useRef, useState, type FormEvent } from 'react';
import { Link, useParams } from 'react-router-dom';
import { AuthLayout } from '../../../components/layouts/auth-layout';
import { Button, buttonClasses } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { LoadingState } from '../../../components/ui/loading-state';
import { TextField } from '../../../components/ui/text-field';
import { useFormErrors } from '../../../hooks/use-form-errors';
import { isApiError, isUnauthorized } from '../../../lib/api-client';
import { formErrorsFrom } from '../../../lib/form-errors';
import type { Session } from '../../../types/api';
import { useMe } from '../../auth/api/get-me';
import { signOut } from '../../auth/api/sign-out';
import { NewPasswordField } from '../../auth/components/new-password-field';
import { validateName, validateNewPassword } from '../../auth/validate';
import { useAcceptInvitation, useInvitation } from '../api/accept-invitation';
import { roleWord } from '../roles';
import type { InvitationPreview } from '../types';

/** `/invitations/:token`: the page an invitation mail links to. */
export function InvitationScreen() {
  const { token = '' } = useParams();
  const invitation = useInvitation(token);
  const me = useMe();
  const accept = useAcceptInvitation(token);
  // Accepting signs in and reloads the session; the page keeps the view it had until
  // the hangar opens, instead of flipping to "you are already a member".
  const [shown, setShown] = useState<{ session: Session | null; signedOut: boolean } | null>(null);

  if (invitation.isPending || me.isPending) {
    return (
      <AuthLayout title="Invitation">
        <LoadingState label="Opening the invitation…" />
      </AuthLayout>
    );
  }
  if (invitation.isError) {
    return (
      <AuthLayout title="This invitation cannot be used">
        <FormAlert>{invitation.error.message}</FormAlert>
        <p className="mt-4 text-sm text-ink-700">
          Each invitation link works once and for seven days. Ask the workspace owner for a new one, or{' '}
          <Link to="/sign-in">sign in</Link>.
        </p>
      </AuthLayout>
    );
  }
  const preview = invitation.data;
  const now = { session: me.isSuccess ? me.data : null, signedOut: me.isError && isUnauthorized(me.error) };
  const accepting = accept.isPending || accept.isSuccess;
  // Remember the view while not accepting (state set during render, guarded so it settles).
  if (!accepting && (shown?.session !== now.session || shown?.signedOut !== now.signedOut)) setShown(now);
  const { session, signedOut } = accepting && shown ? shown : now;

  return (
    <AuthLayout
      title={`Join ${preview.workspace.name}`}
      intro={`${preview.invited_by?.name ?? 'An owner'} invites you to this workspace as ${roleWord(preview.role, true)}.`}
    >
      {session ? (
        <JoinAsMember accept={accept} preview={preview} session={session} />
      ) : signedOut && preview.account_exists ? (
        <div className="space-y-4">
          <p className="text-base text-ink-700">
            An account for <span className="font-mono text-sm text-ink-900">{preview.email}</span> exists already. Sign
            in with it to accept.
          </p>
          <Link
            to={`/sign-in?next=${encodeURIComponent(`/invitations/${token}`)}`}
            className={`${buttonClasses('primary')} w-full no-underline hover:text-white`}
          >
            Sign in to accept
          </Link>
        </div>
      ) : (
        <NewAccountForm accept={accept} token={token} preview={preview} />
      )}
    </AuthLayout>
  );
}

type Accept = ReturnType<typeof useAcceptInvitation>;

function JoinAsMember({ accept, preview, session }: { accept: Accept; preview: InvitationPreview; session: Session }) {
  const member = session.workspaces.find((workspace) => workspace.id === preview.workspace.id);
  const otherAddress = session.user.email.toLowerCase() !== preview.email.toLowerCase();

  if (member) {
    return (
      <div className="space-y-4">
        <FormAlert tone="success">{`You are already a member of ${preview.workspace.name} (${member.role}).`}</FormAlert>
        <Link to={`/w/${preview.workspace.id}/hangar`}>Go to its hangar</Link>
      </div>
    );
  }
  if (otherAddress) return <WrongAccount preview={preview} session={session} />;
  return (
    <div className="space-y-4">
      {accept.isError && <FormAlert>{accept.error.message}</FormAlert>}
      <p className="text-base text-ink-700">
        You are signed in as <span className="font-medium text-ink-900">{session.user.name}</span> (
        <span className="font-mono text-sm">{session.user.email}</span>).
      </p>
      <Button className="w-full" pending={accept.isPending} onClick={() => accept.mutate(undefined)}>
        Accept and join {preview.workspace.name}
      </Button>
    </div>
  );
}

/**
 * An invitation belongs to the address it was sent to (the server answers 403 to any
 * other account), so a pilot signed in under another address is shown the way to switch
 * instead of a button that cannot work. Signing out keeps them on this page, which then
 * offers to sign in with, or create, the invited account.
 */
function WrongAccount({ preview, session }: { preview: InvitationPreview; session: Session }) {
  const queryClient = useQueryClient();
  const switchAccount = useMutation({
    mutationFn: signOut,
    onSuccess: () => queryClient.resetQueries(),
  });
  return (
    <div className="space-y-4">
      <FormAlert>
        {`This invitation is for ${preview.email}, and you are signed in as ${session.user.email}. Only the account with the invited address can accept it.`}
      </FormAlert>
      {switchAccount.isError && <FormAlert>{switchAccount.error.message}</FormAlert>}
      <Button className="w-full" pending={switchAccount.isPending} onClick={() => switchAccount.mutate()}>
        Sign out and switch account
      </Button>
      <p className="text-sm text-ink-700">
        If the invitation should have gone to {session.user.email}, ask the workspace owner to invite that address.
      </p>
    </div>
  );
}

const FIELDS = ['name', 'password'] as const;

function NewAccountForm({ accept, token, preview }: { accept: Accept; token: string; preview: InvitationPreview }) {
  const [values, setValues] = useState({ name: '', password: '' });
  const formRef = useRef<HTMLFormElement>(null);
  const { errors, refuse, clear } = useFormErrors(formRef);

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const local: Record<string, string> = {};
    const name = validateName(values.name);
    if (name) local.name = name;
    const password = validateNewPassword(values.password);
    if (password) local.password = password;
    if (Object.keys(local).length > 0) return refuse({ fields: local, general: null });
    clear();
    accept.mutate(
      { name: values.name.trim(), password: values.password },
      {
        onError: (error) =>
          refuse(
            isApiError(error) && error.code === 'account-exists'
              ? { fields: {}, general: error.message }
              : formErrorsFrom(error, FIELDS),
          ),
      },
    );
  };

  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="space-y-5" aria-label="Create your account and join">
      {errors.general && <FormAlert>{errors.general}</FormAlert>}
      <div>
        <p className="text-sm font-medium text-ink-900">E-mail</p>
        <p className="mt-1 font-mono text-sm text-ink-700">{preview.email}</p>
      </div>
      <TextField
        label="Name"
        name="name"
        autoComplete="name"
        value={values.name}
        onChange={(event) => setValues((v) => ({ ...v, name: event.target.value }))}
        error={errors.fields.name}
      />
      <NewPasswordField
        name="password"
        value={values.password}
        onChange={(event) => setValues((v) => ({ ...v, password: event.target.value }))}
        error={errors.fields.password}
      />
      <Button type="submit" className="w-full" pending={accept.isPending}>
        Create account and join
      </Button>
      <p className="text-sm text-ink-700">
        Have an account under another address?{' '}
        <Link to={`/sign-in?next=${encodeURIComponent(`/invitations/${token}`)}`}>Sign in</Link> and open this link
        again.
      </p>
    </form>
  );
}
