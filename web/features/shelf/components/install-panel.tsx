import { useState } from 'react';
import { Link } from 'react-router-dom';
import { setupSchema } from '@shared/format/schema';
import { Button } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { SelectField } from '../../../components/ui/select-field';
import { useToast } from '../../../components/ui/toast';
import { useRevision } from '../../models/api/get-revision';
import { ModelPicker } from '../../models/components/model-picker';
import type { SetupModelView } from '../../models/types';
import { useInstallReceiver } from '../api/change-receiver';
import { useReuseCheck } from '../api/get-reuse-check';
import type { ShelfUnit } from '../types';
import { ReuseChecklist } from './reuse-checklist';

/** The receiver slots of a stored revision's setup; none when it does not pass the schema. */
function slotsOf(document: unknown): { id: string; label: string | null; role: string; outputs: number }[] {
  const parsed = setupSchema.safeParse(document);
  return parsed.success
    ? parsed.data.receivers.map((receiver) => ({
        id: receiver.id,
        label: receiver.label ?? null,
        role: receiver.role,
        outputs: receiver.outputs,
      }))
    : [];
}

/**
 * Choose a model and one of its receiver slots, read the reuse check for this unit
 * there, then install (or, when the unit is in another slot now, move) it.
 */
export function InstallPanel({ unit, onDone }: { unit: ShelfUnit; onDone: () => void }) {
  const [model, setModel] = useState<SetupModelView | null>(null);
  const [slot, setSlot] = useState('');
  const modelId = model?.id ?? '';
  const latest = useRevision(model?.latest?.id ?? null);
  const slots = latest.data ? slotsOf(latest.data.document) : [];
  const target = modelId && slot ? { modelId, slot } : null;
  const check = useReuseCheck(unit.id, target);
  const install = useInstallReceiver(unit.id);
  const toast = useToast();
  const moving = unit.installed !== null;

  const confirm = () =>
    install.mutate(
      { model: modelId, slot, move: moving },
      {
        onSuccess: (installed) => {
          toast({
            title: `${unit.label} is now receiver ${slot} of ${installed.model.name}`,
            description: installed.ready
              ? 'Its settings already match.'
              : `${installed.changes.length} settings to change before it flies.`,
          });
          onDone();
        },
      },
    );

  return (
    <div className="space-y-4">
      <ModelPicker
        workspaceId={unit.workspace_id}
        value={model}
        onChange={(chosen) => {
          setModel(chosen);
          setSlot('');
        }}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField
          label="As which receiver of the setup"
          value={slot}
          onChange={(event) => setSlot(event.target.value)}
          disabled={!model || latest.isPending}
        >
          <option value="">
            {!model
              ? 'Choose a model first'
              : latest.isPending
                ? 'Loading its receivers…'
                : slots.length === 0
                  ? 'No readable receivers'
                  : 'Choose a receiver…'}
          </option>
          {slots.map((candidate) => (
            <option key={candidate.id} value={candidate.id}>
              {candidate.id}
              {candidate.label ? ` · ${candidate.label}` : ''} · {candidate.role}, {candidate.outputs} outputs
            </option>
          ))}
        </SelectField>
      </div>
      {moving && unit.installed && (
        <p className="text-sm text-ink-700">
          It leaves slot {unit.installed.slot} of {unit.installed.model.name} in the same step; the history keeps both.
        </p>
      )}
      {target &&
        (check.isPending ? (
          <LoadingState label="Checking the unit against this receiver…" />
        ) : check.isError ? (
          <ErrorState title="The reuse check could not run" error={check.error} onRetry={() => void check.refetch()} />
        ) : (
          <ReuseChecklist
            check={check.data}
            action={() => (
              <>
                {check.data.holder && check.data.holder.id !== unit.id && (
                  <p role="status" className="w-full text-base text-caution-700">
                    Receiver {slot} is{' '}
                    <Link to={`/w/${unit.workspace_id}/shelf/${check.data.holder.id}`}>{check.data.holder.label}</Link>{' '}
                    now: take that unit out first to put this one in.
                  </p>
                )}
                <Button
                  onClick={confirm}
                  pending={install.isPending}
                  disabled={Boolean(check.data.holder) || check.data.installed_here}
                >
                  {moving ? 'Move it here' : 'Install it here'}
                </Button>
                <Button variant="secondary" onClick={onDone}>
                  Cancel
                </Button>
                {install.error && (
                  <p role="alert" className="text-sm text-danger-700">
                    {install.error.message}
                  </p>
                )}
              </>
            )}
          />
        ))}
      {!target && (
        <div>
          <Button variant="secondary" onClick={onDone}>
            Cancel
          </Button>
        </div>
      )}
    </div>
  );
}
