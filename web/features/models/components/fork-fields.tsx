import { useState, type FormEvent } from 'react';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { formErrorsFrom, noFormErrors, type FormErrors } from '../../../lib/form-errors';
import type { Id, WorkspaceMembership } from '../../../types/api';
import { useSession } from '../../auth/hooks/use-session';
import { useForkModel } from '../api/create-model';
import { revisionsOf, useRevisions } from '../api/list-revisions';
import { canEdit } from '../permissions';
import type { CreatedModel, SetupModelView } from '../types';
import { ModelPicker } from './model-picker';

/** A revision to fork when the caller already knows it (the History screen). */
export interface ForkSourceChoice {
  modelId: Id;
  modelName: string;
  number: number;
}

export interface ForkFormOptions {
  /** The workspace the fork goes into when it is fixed (the hangar's own). */
  target?: WorkspaceMembership;
  /** The revision to copy when it is fixed. */
  source?: ForkSourceChoice;
  onForked: (created: CreatedModel, sourceText: string) => void;
}

const FIELDS = ['workspace', 'model', 'number', 'name'];

/** The state and submit of a fork form; `ForkFields` draws it. */
export function useForkForm({ target, source, onForked }: ForkFormOptions) {
  const { workspaces } = useSession();
  const fork = useForkModel();
  const writable = workspaces.filter((ws) => canEdit(ws.role));
  const [sourceWorkspaceId, setSourceWorkspaceId] = useState<Id>(target?.id ?? workspaces[0]?.id ?? '');
  const [sourceModel, setSourceModel] = useState<SetupModelView | null>(null);
  const sourceModelId = source?.modelId ?? sourceModel?.id ?? '';
  const [number, setNumber] = useState<number | null>(source?.number ?? null);
  const [targetWorkspaceId, setTargetWorkspaceId] = useState<Id>(target?.id ?? writable[0]?.id ?? '');
  const [name, setName] = useState('');
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);
  const [attempt, setAttempt] = useState(0);

  const sourceName = source?.modelName ?? sourceModel?.name ?? '';
  // Until a revision is picked, the fork copies the source's latest.
  const chosenNumber = number ?? sourceModel?.latest?.number ?? null;

  function submit(event: FormEvent) {
    event.preventDefault();
    setAttempt((n) => n + 1);
    const fields: Record<string, string> = {};
    if (!sourceModelId) fields.model = 'Choose the model to fork.';
    else if (chosenNumber === null) fields.number = 'Choose the revision to copy.';
    if (!targetWorkspaceId) fields.workspace = 'You can edit no workspace to fork into.';
    if (Object.keys(fields).length > 0) return setErrors({ fields, general: null });
    setErrors(noFormErrors);
    fork.mutate(
      { modelId: sourceModelId, number: chosenNumber!, workspaceId: targetWorkspaceId, name: name.trim() || undefined },
      {
        onSuccess: (created) => onForked(created, `${sourceName} revision ${chosenNumber}`),
        onError: (error) => setErrors(formErrorsFrom(error, FIELDS)),
      },
    );
  }

  return {
    target,
    source,
    workspaces,
    writable,
    sourceWorkspaceId,
    setSourceWorkspaceId: (id: Id) => {
      setSourceWorkspaceId(id);
      setSourceModel(null);
      setNumber(null);
    },
    sourceModel,
    sourceModelId,
    setSourceModel: (model: SetupModelView | null) => {
      setSourceModel(model);
      setNumber(null);
    },
    sourceName,
    chosenNumber,
    setNumber,
    targetWorkspaceId,
    setTargetWorkspaceId,
    name,
    setName,
    errors,
    attempt,
    pending: fork.isPending,
    submit,
  };
}

export type ForkForm = ReturnType<typeof useForkForm>;

export function ForkFields({ fork, chooseSource = false }: { fork: ForkForm; chooseSource?: boolean }) {
  const { errors } = fork;
  return (
    <>
      {chooseSource && (
        <>
          <SelectField
            label="From workspace"
            value={fork.sourceWorkspaceId}
            onChange={(event) => fork.setSourceWorkspaceId(event.target.value)}
            data-autofocus
          >
            {fork.workspaces.map((ws) => (
              <option key={ws.id} value={ws.id}>
                {ws.name}
              </option>
            ))}
          </SelectField>
          <ModelPicker
            key={fork.sourceWorkspaceId}
            workspaceId={fork.sourceWorkspaceId}
            value={fork.sourceModel}
            onChange={fork.setSourceModel}
            error={errors.fields.model}
            describe={(model) => `${model.name}${model.latest ? ` (latest r${model.latest.number})` : ''}`}
          />
          {fork.sourceModelId && <RevisionChoice fork={fork} />}
        </>
      )}
      {!fork.target && (
        <SelectField
          label="Into workspace"
          value={fork.targetWorkspaceId}
          onChange={(event) => fork.setTargetWorkspaceId(event.target.value)}
          error={errors.fields.workspace}
          data-autofocus
        >
          {fork.writable.length === 0 && <option value="">No workspace you can edit</option>}
          {fork.writable.map((ws) => (
            <option key={ws.id} value={ws.id}>
              {ws.name}
            </option>
          ))}
        </SelectField>
      )}
      <TextField
        label="Name of the new model (optional)"
        hint={
          fork.sourceName ? `Left empty: “${fork.sourceName} (fork)”.` : 'Left empty: the source’s name with “(fork)”.'
        }
        value={fork.name}
        onChange={(event) => fork.setName(event.target.value)}
        error={errors.fields.name}
        maxLength={80}
        autoComplete="off"
      />
    </>
  );
}

function RevisionChoice({ fork }: { fork: ForkForm }) {
  const revisions = useRevisions(fork.sourceModelId);
  const list = revisionsOf(revisions.data?.pages);
  return (
    <SelectField
      label="Revision"
      value={fork.chosenNumber === null ? '' : String(fork.chosenNumber)}
      onChange={(event) => fork.setNumber(Number(event.target.value))}
      error={fork.errors.fields.number}
      disabled={revisions.isPending}
    >
      {list.length === 0 && (
        <option value="">{revisions.isPending ? 'Loading revisions…' : 'No revisions could be loaded'}</option>
      )}
      {list.map((revision) => (
        <option key={revision.id} value={revision.number}>
          r{revision.number}
          {revision.message ? `: ${revision.message.slice(0, 60)}` : ''}
          {revision.tags.length > 0 ? ` [${revision.tags.join(', ')}]` : ''}
        </option>
      ))}
    </SelectField>
  );
}
