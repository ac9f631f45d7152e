import { useRef, useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField } from '../../../components/ui/text-field';
import { useFormErrors } from '../../../hooks/use-form-errors';
import { formErrorsFrom } from '../../../lib/form-errors';
import { useSignUp } from '../api/sign-up';
import { landingPath } from '../landing-path';
import { validateSignUp } from '../validate';
import { NewPasswordField } from './new-password-field';

const FIELDS = ['email', 'name', 'password'] as const;

export function CreateAccountForm() {
  const [values, setValues] = useState({ email: '', name: '', password: '' });
  const formRef = useRef<HTMLFormElement>(null);
  const navigate = useNavigate();
  const signUp = useSignUp();
  const { errors, refuse, clear } = useFormErrors(formRef);

  const change = (field: (typeof FIELDS)[number]) => (event: { target: { value: string } }) =>
    setValues((current) => ({ ...current, [field]: event.target.value }));

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const local = validateSignUp(values);
    if (Object.keys(local).length > 0) return refuse({ fields: local, general: null });
    clear();
    signUp.mutate(
      { email: values.email.trim(), name: values.name.trim(), password: values.password },
      {
        onSuccess: (session) => void navigate(landingPath(session, null), { replace: true }),
        onError: (error) => refuse(formErrorsFrom(error, FIELDS)),
      },
    );
  };

  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="space-y-5" aria-label="Create account">
      {errors.general && <FormAlert>{errors.general}</FormAlert>}
      <TextField
        label="Name"
        name="name"
        autoComplete="name"
        value={values.name}
        onChange={change('name')}
        error={errors.fields.name}
      />
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        inputMode="email"
        value={values.email}
        onChange={change('email')}
        error={errors.fields.email}
      />
      <NewPasswordField
        name="password"
        value={values.password}
        onChange={change('password')}
        error={errors.fields.password}
      />
      <Button type="submit" className="w-full" pending={signUp.isPending}>
        Create account
      </Button>
      <p className="text-sm text-ink-700">
        Already have an account? <Link to="/sign-in">Sign in</Link>
      </p>
    </form>
  );
}
