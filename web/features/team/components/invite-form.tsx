import { useRef, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { FormAlert } from '../../../components/ui/form-alert';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { useFormErrors } from '../../../hooks/use-form-errors';
import { formErrorsFrom } from '../../../lib/form-errors';
import type { Id, Role } from '../../../types/api';
import { validateEmail } from '../../auth/validate';
import { useInviteMember } from '../api/invitations';
import { ROLE_CHOICES } from '../roles';

const FIELDS = ['email', 'role'] as const;

export function InviteForm({ workspaceId }: { workspaceId: Id }) {
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<Role>('reviewer');
  const [sent, setSent] = useState<string | null>(null);
  const formRef = useRef<HTMLFormElement>(null);
  const invite = useInviteMember(workspaceId);
  const { errors, refuse, clear } = useFormErrors(formRef);

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    setSent(null);
    const problem = validateEmail(email);
    if (problem) return refuse({ fields: { email: problem.replace('your ', 'an ') }, general: null });
    clear();
    invite.mutate(
      { email: email.trim(), role },
      {
        onSuccess: (invitation) => {
          setSent(`An invitation is on its way to ${invitation.email}. The link works once, for seven days.`);
          setEmail('');
        },
        onError: (error) => refuse(formErrorsFrom(error, FIELDS)),
      },
    );
  };

  return (
    <Card className="p-5">
      <h2 className="text-lg font-semibold text-ink-900">Invite a member</h2>
      <p className="mt-0.5 text-sm text-ink-700">
        Bindery e-mails a link that adds them with the role you choose, or creates their account.
      </p>
      <form ref={formRef} onSubmit={onSubmit} noValidate className="mt-4 space-y-4" aria-label="Invite a member">
        {errors.general && <FormAlert>{errors.general}</FormAlert>}
        {sent && <FormAlert tone="success">{sent}</FormAlert>}
        <div className="grid gap-4 sm:grid-cols-[1fr_12rem]">
          <TextField
            label="E-mail"
            name="email"
            type="email"
            inputMode="email"
            autoComplete="off"
            placeholder="club.mate@example.org"
            value={email}
            onChange={(event) => setEmail(event.target.value)}
            error={errors.fields.email}
          />
          <SelectField
            label="Role"
            name="role"
            value={role}
            onChange={(event) => setRole(event.target.value as Role)}
            error={errors.fields.role}
          >
            {ROLE_CHOICES.map((choice) => (
              <option key={choice.value} value={choice.value}>
                {choice.label}
              </option>
            ))}
          </SelectField>
        </div>
        <p className="text-sm text-ink-700">
          {ROLE_CHOICES.find((choice) => choice.value === role)?.label}:{' '}
          {ROLE_CHOICES.find((choice) => choice.value === role)?.hint}.
        </p>
        <Button type="submit" pending={invite.isPending}>
          Send invitation
        </Button>
      </form>
    </Card>
  );
}
