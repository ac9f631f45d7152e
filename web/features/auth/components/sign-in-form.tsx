import { useRef, useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField } from '../../../components/ui/text-field';
import { useFormErrors } from '../../../hooks/use-form-errors';
import { formErrorsFrom } from '../../../lib/form-errors';
import { useSignIn } from '../api/sign-in';
import { landingPath } from '../landing-path';
import { validateSignIn } from '../validate';

const FIELDS = ['email', 'password'] as const;

export function SignInForm() {
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const formRef = useRef<HTMLFormElement>(null);
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const signIn = useSignIn();
  const { errors, refuse, clear } = useFormErrors(formRef);

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const local = validateSignIn({ email, password });
    if (Object.keys(local).length > 0) return refuse({ fields: local, general: null });
    clear();
    signIn.mutate(
      { email: email.trim(), password },
      {
        onSuccess: (session) => void navigate(landingPath(session, params.get('next')), { replace: true }),
        onError: (error) => refuse(formErrorsFrom(error, FIELDS)),
      },
    );
  };

  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="space-y-5" aria-label="Sign in">
      {errors.general && <FormAlert>{errors.general}</FormAlert>}
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="username"
        inputMode="email"
        value={email}
        onChange={(event) => setEmail(event.target.value)}
        error={errors.fields.email}
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="current-password"
        value={password}
        onChange={(event) => setPassword(event.target.value)}
        error={errors.fields.password}
      />
      <Button type="submit" className="w-full" pending={signIn.isPending}>
        Sign in
      </Button>
      <div className="flex flex-wrap justify-between gap-2 text-sm">
        <Link to="/reset-password">Forgot your password?</Link>
        <Link to="/create-account">Create an account</Link>
      </div>
    </form>
  );
}
