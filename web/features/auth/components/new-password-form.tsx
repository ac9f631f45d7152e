import { useRef, useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { LoadingState } from '../../../components/ui/loading-state';
import { TextField } from '../../../components/ui/text-field';
import { useFormErrors } from '../../../hooks/use-form-errors';
import { formErrorsFrom } from '../../../lib/form-errors';
import { useConfirmPasswordReset, useResetLink } from '../api/confirm-password-reset';
import { landingPath } from '../landing-path';
import { validateNewPassword } from '../validate';
import { NewPasswordField } from './new-password-field';

const FIELDS = ['password'] as const;

/** The form behind a reset link: the new password twice, then straight into the app. */
export function NewPasswordForm({ token }: { token: string }) {
  const link = useResetLink(token);
  const [password, setPassword] = useState('');
  const [repeat, setRepeat] = useState('');
  const formRef = useRef<HTMLFormElement>(null);
  const confirm = useConfirmPasswordReset(token);
  const navigate = useNavigate();
  const { errors, refuse, clear } = useFormErrors(formRef);

  if (link.isPending) return <LoadingState label="Checking the link…" />;
  if (link.isError) {
    return (
      <div className="space-y-4">
        <FormAlert>{link.error.message}</FormAlert>
        <p className="text-sm text-ink-700">
          <Link to="/reset-password">Ask for a new link</Link> or <Link to="/sign-in">sign in</Link>.
        </p>
      </div>
    );
  }

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const weak = validateNewPassword(password);
    if (weak) return refuse({ fields: { password: weak }, general: null });
    if (repeat !== password)
      return refuse({ fields: { repeat: 'The two passwords differ. Type the same one twice.' }, general: null });
    clear();
    confirm.mutate(password, {
      onSuccess: (session) => void navigate(landingPath(session, null), { replace: true }),
      onError: (error) => refuse(formErrorsFrom(error, FIELDS)),
    });
  };

  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="space-y-5" aria-label="Choose a new password">
      {errors.general && <FormAlert>{errors.general}</FormAlert>}
      <p className="text-base text-ink-700">
        For <span className="font-mono text-sm text-ink-900">{link.data.email}</span>. Every other place this account is
        signed in will be signed out.
      </p>
      <NewPasswordField
        label="New password"
        name="password"
        value={password}
        onChange={(event) => setPassword(event.target.value)}
        error={errors.fields.password}
      />
      <TextField
        label="The new password again"
        name="repeat"
        type="password"
        autoComplete="new-password"
        value={repeat}
        onChange={(event) => setRepeat(event.target.value)}
        error={errors.fields.repeat}
      />
      <Button type="submit" className="w-full" pending={confirm.isPending}>
        Set the new password
      </Button>
    </form>
  );
}
