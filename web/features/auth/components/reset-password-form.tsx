import { useRef, useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField } from '../../../components/ui/text-field';
import { useFormErrors } from '../../../hooks/use-form-errors';
import { formErrorsFrom } from '../../../lib/form-errors';
import { useRequestPasswordReset } from '../api/request-password-reset';
import { validateEmail } from '../validate';

const FIELDS = ['email'] as const;

// Said when the server accepts the request without wording of its own.
const SENT = 'If an account uses that address, a message with a reset link is on its way.';

export function ResetPasswordForm() {
  const [email, setEmail] = useState('');
  const [answer, setAnswer] = useState<string | null>(null);
  const formRef = useRef<HTMLFormElement>(null);
  const request = useRequestPasswordReset();
  const { errors, refuse, clear } = useFormErrors(formRef);

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    setAnswer(null);
    const problem = validateEmail(email);
    if (problem) return refuse({ fields: { email: problem }, general: null });
    clear();
    request.mutate(
      { email: email.trim() },
      {
        onSuccess: (message) => setAnswer(message ?? SENT),
        onError: (error) => refuse(formErrorsFrom(error, FIELDS)),
      },
    );
  };

  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="space-y-5" aria-label="Reset password">
      {errors.general && <FormAlert>{errors.general}</FormAlert>}
      {answer && <FormAlert tone="success">{answer}</FormAlert>}
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        inputMode="email"
        value={email}
        onChange={(event) => setEmail(event.target.value)}
        error={errors.fields.email}
      />
      <Button type="submit" className="w-full" pending={request.isPending}>
        Send reset link
      </Button>
      <p className="text-sm text-ink-700">
        Remembered it? <Link to="/sign-in">Sign in</Link>
      </p>
    </form>
  );
}
