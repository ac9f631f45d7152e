import { useRef, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField } from '../../../components/ui/text-field';
import { useToast } from '../../../components/ui/toast';
import { useFormErrors } from '../../../hooks/use-form-errors';
import { formErrorsFrom } from '../../../lib/form-errors';
import { NewPasswordField } from '../../auth/components/new-password-field';
import { validateNewPassword } from '../../auth/validate';
import { useChangePassword } from '../api/change-password';

const FIELDS = ['current', 'password'] as const;

/** The current password once, the new one twice; every other session ends on success. */
export function ChangePasswordForm() {
  const [current, setCurrent] = useState('');
  const [password, setPassword] = useState('');
  const [repeat, setRepeat] = useState('');
  const formRef = useRef<HTMLFormElement>(null);
  const { errors, refuse, clear } = useFormErrors(formRef);
  const change = useChangePassword();
  const toast = useToast();

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    if (!current) return refuse({ fields: { current: 'Enter your current password.' }, general: null });
    const passwordProblem = validateNewPassword(password);
    if (passwordProblem) return refuse({ fields: { password: passwordProblem }, general: null });
    if (repeat !== password)
      return refuse({ fields: { repeat: 'The two passwords differ. Type the same one twice.' }, general: null });
    clear();
    change.mutate(
      { current, password },
      {
        onSuccess: () => {
          setCurrent('');
          setPassword('');
          setRepeat('');
          toast({
            title: 'Password changed',
            description: 'Every other place this account was signed in is now signed out.',
            tone: 'success',
          });
        },
        onError: (error) => refuse(formErrorsFrom(error, FIELDS)),
      },
    );
  };

  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="max-w-md space-y-5" aria-label="Change your password">
      {errors.general && <FormAlert>{errors.general}</FormAlert>}
      <TextField
        label="Current password"
        name="current"
        type="password"
        autoComplete="current-password"
        value={current}
        onChange={(event) => setCurrent(event.target.value)}
        error={errors.fields.current}
      />
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
      <Button type="submit" pending={change.isPending}>
        Change the password
      </Button>
    </form>
  );
}
