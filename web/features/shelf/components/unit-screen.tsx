import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { Dialog } from '../../../components/ui/dialog';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { useToast } from '../../../components/ui/toast';
import { exactTime } from '../../models/format-time';
import { canEdit } from '../../models/permissions';
import { useCurrentWorkspace } from '../../workspaces/hooks/use-current-workspace';
import { useRemoveReceiver, useUpdateReceiver } from '../api/change-receiver';
import { useReceiver } from '../api/get-receiver';
import type { ShelfUnit } from '../types';
import { CurrentSlotCheck } from './current-slot-check';
import { InstallPanel } from './install-panel';
import { MarkLabel } from './mark-label';
import { ReadinessBadge } from './readiness-badge';
import { ReceiverFieldsForm } from './receiver-fields-form';
import { StoredSettingsEditor } from './stored-settings-editor';
import { StoredSettingsTable } from './stored-settings-table';
import { UnitHistory } from './unit-history';

function Section({
  title,
  children,
  actions,
}: {
  title: string;
  children: React.ReactNode;
  actions?: React.ReactNode;
}) {
  return (
    <Card className="px-5 py-4">
      <section>
        <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
          <h2 className="text-lg font-semibold text-ink-900">{title}</h2>
          {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
        </div>
        {children}
      </section>
    </Card>
  );
}

function EditDetailsDialog({ unit, onClose }: { unit: ShelfUnit; onClose: () => void }) {
  const update = useUpdateReceiver(unit.id);
  return (
    <Dialog title={`Edit ${unit.label}`} onClose={onClose}>
      <ReceiverFieldsForm
        initial={unit}
        submitLabel="Save the record"
        pending={update.isPending}
        error={update.error}
        onCancel={onClose}
        onSubmit={(values) => update.mutate(values, { onSuccess: onClose })}
      />
    </Dialog>
  );
}

function RemoveDialog({ unit, onClose }: { unit: ShelfUnit; onClose: () => void }) {
  const remove = useRemoveReceiver(unit.id);
  const toast = useToast();
  return (
    <Dialog
      title={`Take ${unit.label} out?`}
      description="It goes back on the shelf, free, keeping the settings it holds; its history keeps this stay."
      onClose={onClose}
    >
      {remove.error && (
        <p role="alert" className="mb-3 text-sm text-danger-700">
          {remove.error.message}
        </p>
      )}
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={onClose}>
          Keep it installed
        </Button>
        <Button
          variant="danger"
          pending={remove.isPending}
          onClick={() =>
            remove.mutate(undefined, {
              onSuccess: () => {
                toast({ title: `${unit.label} is back on the shelf` });
                onClose();
              },
            })
          }
        >
          Remove from the model
        </Button>
      </div>
    </Dialog>
  );
}

export function UnitScreen() {
  const { receiverId = '' } = useParams();
  const { inUrl } = useCurrentWorkspace();
  const unit = useReceiver(receiverId);
  const [dialog, setDialog] = useState<'edit' | 'remove' | null>(null);
  const [placing, setPlacing] = useState(false);
  const [recording, setRecording] = useState(false);

  if (!inUrl) return null;
  const shelfPath = `/w/${inUrl.id}/shelf`;
  const breadcrumb = (
    <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-700">
      <Link to={shelfPath}>Shelf</Link>
      <span aria-hidden="true" className="px-1.5 text-ink-500">
        /
      </span>
      <span>{unit.data?.label ?? 'Receiver'}</span>
    </nav>
  );
  if (unit.isPending)
    return (
      <>
        {breadcrumb}
        <LoadingState label="Loading the receiver…" />
      </>
    );
  if (unit.isError)
    return (
      <>
        {breadcrumb}
        <ErrorState title="This receiver could not be loaded" error={unit.error} onRetry={() => void unit.refetch()} />
      </>
    );

  const data = unit.data;
  const editor = canEdit(inUrl.role);
  const installed = data.installed;

  return (
    <>
      {breadcrumb}
      <PageHeader
        title={data.label}
        documentTitle={`${data.label} · Shelf`}
        description={
          <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <MarkLabel mark={data.mark} colour={data.mark_colour} />
            <span aria-hidden="true">·</span>
            <span>{data.outputs} outputs</span>
            <span aria-hidden="true">·</span>
            <span>
              Short code <code className="font-mono text-base font-semibold text-ink-900">{data.short_code}</code>
            </span>
          </span>
        }
        actions={
          <>
            <Link
              to={`/w/${inUrl.id}/shelf/labels?units=${data.id}&sheet=single`}
              className={buttonClasses('secondary')}
            >
              Print its label
            </Link>
            {editor && (
              <Button variant="secondary" onClick={() => setDialog('edit')}>
                Edit details
              </Button>
            )}
          </>
        }
      />
      {dialog === 'edit' && <EditDetailsDialog unit={data} onClose={() => setDialog(null)} />}
      {dialog === 'remove' && <RemoveDialog unit={data} onClose={() => setDialog(null)} />}

      <div className="space-y-6">
        {data.notes && <p className="max-w-prose text-base whitespace-pre-line text-ink-700">{data.notes}</p>}
        <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,4fr)]">
          <Section
            title="Where it is"
            actions={
              editor &&
              !placing && (
                <>
                  <Button variant="secondary" size="sm" onClick={() => setPlacing(true)}>
                    {installed ? 'Move to another model or receiver' : 'Install into a model'}
                  </Button>
                  {installed && (
                    <Button variant="secondary" size="sm" onClick={() => setDialog('remove')}>
                      Remove
                    </Button>
                  )}
                </>
              )
            }
          >
            {installed ? (
              <div className="space-y-2">
                <p className="text-base">
                  In <Link to={`/models/${installed.model.id}/overview`}>{installed.model.name}</Link>, as receiver{' '}
                  <code className="font-mono text-sm">{installed.slot}</code>, since{' '}
                  <time dateTime={installed.since}>{exactTime(installed.since)}</time>.
                </p>
                {data.readiness && <ReadinessBadge readiness={data.readiness} />}
                <p className="text-sm">
                  <Link to={`/models/${installed.model.id}/sheet`}>Field sheet of {installed.model.name}</Link>
                </p>
              </div>
            ) : (
              <p className="text-base text-ink-700">Free, on the shelf.</p>
            )}
          </Section>
          <Section
            title="Settings it holds"
            actions={
              editor &&
              !recording && (
                <Button variant="secondary" size="sm" onClick={() => setRecording(true)}>
                  Record what it holds
                </Button>
              )
            }
          >
            {recording ? (
              <StoredSettingsEditor
                receiverId={data.id}
                outputs={data.outputs}
                settings={data.stored_settings}
                onDone={() => setRecording(false)}
              />
            ) : (
              <StoredSettingsTable
                settings={data.stored_settings}
                outputs={data.outputs}
                recordedAt={data.settings_recorded_at}
              />
            )}
          </Section>
        </div>

        {placing && (
          <Section title={installed ? 'Move it to another model or receiver' : 'Install it into a model'}>
            <InstallPanel unit={data} onDone={() => setPlacing(false)} />
          </Section>
        )}

        {installed && !placing && (
          <Section title={`Before it flies in ${installed.model.name}`}>
            <CurrentSlotCheck unit={{ ...data, installed }} editor={editor} />
          </Section>
        )}

        <Section title="History">
          <UnitHistory receiverId={data.id} />
        </Section>
      </div>
    </>
  );
}
