import { useId, useRef, useState, type FormEvent, type ReactNode } from 'react';
import { useNavigate } from 'react-router-dom';
import type { Finding } from '@shared/findings';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField } from '../../../components/ui/text-field';
import { useToast } from '../../../components/ui/toast';
import { useFocusFirstInvalid } from '../../../hooks/use-focus-first-invalid';
import { isApiError } from '../../../lib/api-client';
import { cx } from '../../../lib/cx';
import { formErrorsFrom, noFormErrors, type FormErrors } from '../../../lib/form-errors';
import type { WorkspaceMembership } from '../../../types/api';
import { FindingsList } from '../../findings/components/findings-list';
import { useCreateModel, useUploadModel } from '../api/create-model';
import type { CreatedModel } from '../types';
import { ForkFields, useForkForm } from './fork-fields';

type Mode = 'blank' | 'file' | 'fork';

const MODES: { mode: Mode; label: string; description: string }[] = [
  { mode: 'blank', label: 'Blank', description: 'A starter setup to edit: one receiver, the four main channels.' },
  { mode: 'file', label: 'From a file', description: 'A .yaml or .yml setup document from your computer.' },
  {
    mode: 'fork',
    label: 'Fork',
    description: 'A copy of another model’s revision; the new model remembers where it came from.',
  },
];

// The server's limit on an upload (api/middleware/setup-upload.ts); checked here first
// so a large file is refused before it is sent.
const MAX_FILE_BYTES = 512 * 1024;

export function NewModelDialog({ workspace, onClose }: { workspace: WorkspaceMembership; onClose: () => void }) {
  const [mode, setMode] = useState<Mode>('blank');
  const legendId = useId();
  return (
    <Dialog title="New model" description={`It goes into ${workspace.name}.`} onClose={onClose}>
      <fieldset>
        <legend id={legendId} className="text-sm font-medium text-ink-900">
          Start from
        </legend>
        <div
          role="radiogroup"
          aria-labelledby={legendId}
          className="mt-1.5 grid grid-cols-3 gap-1 rounded-md border border-ply-300 bg-paper p-1"
        >
          {MODES.map((option) => (
            <label
              key={option.mode}
              className={cx(
                'cursor-pointer rounded-sm px-2 py-1.5 text-center text-sm font-medium has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-accent-600',
                mode === option.mode ? 'bg-paper-raised text-ink-900 shadow-card' : 'text-ink-700 hover:text-ink-900',
              )}
            >
              <input
                type="radio"
                name="new-model-mode"
                value={option.mode}
                checked={mode === option.mode}
                onChange={() => setMode(option.mode)}
                className="sr-only"
              />
              {option.label}
            </label>
          ))}
        </div>
        <p className="mt-2 text-sm text-ink-700">{MODES.find((option) => option.mode === mode)?.description}</p>
      </fieldset>
      <div className="mt-4">
        {mode === 'blank' && <BlankForm workspace={workspace} onClose={onClose} />}
        {mode === 'file' && <FileForm workspace={workspace} onClose={onClose} />}
        {mode === 'fork' && <ForkForm workspace={workspace} onClose={onClose} />}
      </div>
    </Dialog>
  );
}

/** Opens the new model and says so. */
function useOpenCreated() {
  const navigate = useNavigate();
  const toast = useToast();
  return (created: CreatedModel, how: string) => {
    toast({ title: `${created.model.name} is in the hangar`, description: how });
    void navigate(`/models/${created.model.id}/overview`);
  };
}

function Actions({ onClose, pending, submit }: { onClose: () => void; pending: boolean; submit: string }) {
  return (
    <div className="mt-5 flex justify-end gap-2">
      <Button variant="secondary" onClick={onClose}>
        Cancel
      </Button>
      <Button type="submit" pending={pending}>
        {submit}
      </Button>
    </div>
  );
}

function FormShell({
  onSubmit,
  errors,
  attempt,
  children,
}: {
  onSubmit: (event: FormEvent) => void;
  errors: FormErrors;
  attempt: number;
  children: ReactNode;
}) {
  const form = useRef<HTMLFormElement>(null);
  useFocusFirstInvalid(form, attempt);
  return (
    <form ref={form} noValidate onSubmit={onSubmit} className="space-y-4">
      {errors.general && <FormAlert>{errors.general}</FormAlert>}
      {children}
    </form>
  );
}

function BlankForm({ workspace, onClose }: { workspace: WorkspaceMembership; onClose: () => void }) {
  const create = useCreateModel();
  const open = useOpenCreated();
  const [name, setName] = useState('');
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);
  const [attempt, setAttempt] = useState(0);

  function submit(event: FormEvent) {
    event.preventDefault();
    setAttempt((n) => n + 1);
    if (!name.trim()) return setErrors({ fields: { name: 'Give the model a name.' }, general: null });
    setErrors(noFormErrors);
    create.mutate(
      { workspaceId: workspace.id, name: name.trim() },
      {
        onSuccess: (created) => open(created, 'Revision 1 is the starter setup.'),
        onError: (error) => setErrors(formErrorsFrom(error, ['name'])),
      },
    );
  }

  return (
    <FormShell onSubmit={submit} errors={errors} attempt={attempt}>
      <TextField
        label="Name"
        value={name}
        onChange={(event) => setName(event.target.value)}
        error={errors.fields.name}
        maxLength={80}
        autoComplete="off"
        data-autofocus
      />
      <Actions onClose={onClose} pending={create.isPending} submit="Create model" />
    </FormShell>
  );
}

function FileForm({ workspace, onClose }: { workspace: WorkspaceMembership; onClose: () => void }) {
  const upload = useUploadModel();
  const open = useOpenCreated();
  const [file, setFile] = useState<File | null>(null);
  const [name, setName] = useState('');
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);
  const [findings, setFindings] = useState<Finding[]>([]);
  const [attempt, setAttempt] = useState(0);
  const fileId = useId();

  function submit(event: FormEvent) {
    event.preventDefault();
    setAttempt((n) => n + 1);
    setFindings([]);
    if (!file) return setErrors({ fields: { file: 'Choose a .yaml or .yml file.' }, general: null });
    if (file.size > MAX_FILE_BYTES)
      return setErrors({
        fields: { file: 'The file is larger than 512 KB; a setup is normally a few kilobytes.' },
        general: null,
      });
    setErrors(noFormErrors);
    upload.mutate(
      { workspaceId: workspace.id, file, name: name.trim() || undefined },
      {
        onSuccess: (created) => open(created, `Revision 1 is ${file.name}.`),
        onError: (error) => {
          setErrors(formErrorsFrom(error, ['name', 'file']));
          const details = isApiError(error) ? (error.details as { findings?: Finding[] } | null) : null;
          if (details?.findings) setFindings(details.findings);
        },
      },
    );
  }

  return (
    <FormShell onSubmit={submit} errors={errors} attempt={attempt}>
      <div>
        <label htmlFor={fileId} className="block text-sm font-medium text-ink-900">
          Setup file
        </label>
        <input
          id={fileId}
          type="file"
          accept=".yaml,.yml,application/yaml,text/yaml,text/plain"
          aria-invalid={errors.fields.file ? true : undefined}
          aria-describedby={errors.fields.file ? `${fileId}-error` : undefined}
          onChange={(event) => setFile(event.target.files?.[0] ?? null)}
          data-autofocus
          className="mt-1.5 block w-full text-base text-ink-900 file:mr-3 file:h-10 file:rounded-md file:border file:border-ply-500 file:bg-paper-raised file:px-4 file:font-medium file:text-ink-900 hover:file:bg-ply-100"
        />
        {errors.fields.file && (
          <p id={`${fileId}-error`} className="mt-1.5 text-sm text-danger-700">
            {errors.fields.file}
          </p>
        )}
      </div>
      <TextField
        label="Name (optional)"
        hint="Left empty, the model takes the name written in the file."
        value={name}
        onChange={(event) => setName(event.target.value)}
        error={errors.fields.name}
        maxLength={80}
        autoComplete="off"
      />
      {findings.length > 0 && <FindingsList findings={findings} />}
      <Actions onClose={onClose} pending={upload.isPending} submit="Upload and create" />
    </FormShell>
  );
}

function ForkForm({ workspace, onClose }: { workspace: WorkspaceMembership; onClose: () => void }) {
  const open = useOpenCreated();
  const fork = useForkForm({
    target: workspace,
    onForked: (created, source) => open(created, `Revision 1 is a copy of ${source}.`),
  });
  return (
    <FormShell onSubmit={fork.submit} errors={fork.errors} attempt={fork.attempt}>
      <ForkFields fork={fork} chooseSource />
      <Actions onClose={onClose} pending={fork.pending} submit="Fork into this workspace" />
    </FormShell>
  );
}
