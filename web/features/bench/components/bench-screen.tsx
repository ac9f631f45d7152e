import { useMemo, useState, type ReactNode } from 'react';
import { useParams } from 'react-router-dom';
import { controlsById, switchPositionOf } from '@shared/evaluate/control-value';
import { evaluate, mixIsActive, mixWeight, valueOf } from '@shared/evaluate/evaluate';
import { expoCurve } from '@shared/evaluate/expo-curve';
import { mixCurve } from '@shared/evaluate/mix-curve';
import { restPositions } from '@shared/evaluate/rest';
import { setupSchema, type Setup } from '@shared/format/schema';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { CautionsPanel } from '../../cautions/components/cautions-panel';
import { FindingsList } from '../../findings/components/findings-list';
import { useModel } from '../../models/api/get-model';
import { useAddressedRevision } from '../../models/api/use-addressed-revision';
import type { Revision, SetupModelView } from '../../models/types';
import { ChannelTable } from './channel-table';
import { ControlPanel, controlName, type Positions } from './control-panel';
import { LinkPanel, receiverName } from './link-panel';
import { MixCurvePlot } from './mix-curve-plot';
import { ReceiverPins } from './receiver-pins';
import { RevisionPicker } from './revision-picker';

export function BenchScreen() {
  const { modelId = '' } = useParams();
  const model = useModel(modelId);
  // `?revision=` by number (as people write it) or id; the latest without.
  const addressed = useAddressedRevision(modelId, model.data?.latest?.id);
  const revision = addressed.revision;

  let body: ReactNode;
  if (model.isPending || addressed.pending) body = <LoadingState label="Loading the setup…" />;
  else if (model.isError)
    body = (
      <ErrorState title="This model could not be loaded" error={model.error} onRetry={() => void model.refetch()} />
    );
  else if (addressed.invalid || addressed.error || revision.isError)
    body = (
      <ErrorState
        title={
          addressed.asked
            ? `There is no revision “${addressed.asked}” of this model`
            : 'This revision could not be loaded'
        }
        error={addressed.invalid ? new Error('Name a revision by its number, like ?revision=9.') : addressed.error}
        onRetry={() => void revision.refetch()}
      />
    );
  else if (!revision.data)
    body = (
      <EmptyState title="This model has no revision yet">Save a setup in the editor to try it on the bench.</EmptyState>
    );
  else if (revision.data.model_id !== model.data.id) {
    body = (
      <ErrorState
        title="That revision is not one of this model’s"
        error={new Error('Pick a revision of this model to put on the bench.')}
      />
    );
  } else body = <BenchForRevision model={model.data} revision={revision.data} />;

  return (
    <>
      <PageHeader
        title="Bench"
        documentTitle={model.data ? `Bench · ${model.data.name}` : 'Bench'}
        description="Set sticks, knobs and switches and read what every channel and receiver pin puts out, and what each pin does when the link is lost."
        actions={
          model.data &&
          revision.data && <RevisionPicker modelId={model.data.id} current={revision.data} latest={model.data.latest} />
        }
      />
      {body}
    </>
  );
}

function BenchForRevision({ model, revision }: { model: SetupModelView; revision: Revision }) {
  const parsed = useMemo(() => setupSchema.safeParse(revision.document), [revision.document]);
  if (!parsed.success) {
    const blocking = revision.findings.filter(
      (finding) => finding.severity === 'error' && (finding.rule === 'schema' || finding.rule === 'syntax'),
    );
    return (
      <div className="space-y-4">
        <ErrorState
          title={`Revision ${revision.number} cannot go on the bench`}
          error={
            new Error(
              'Some fields are missing or of the wrong kind, so its outputs cannot be worked out. Fix these in the editor first.',
            )
          }
        />
        <FindingsList findings={blocking.length > 0 ? blocking : revision.findings} modelId={model.id} />
      </div>
    );
  }
  return <Bench key={revision.id} setup={parsed.data} />;
}

/** The link in words: who has lost it, what their pins do, and that the others still follow the controls. */
function linkStatus(lostNames: readonly string[], receivers: number): string {
  if (lostNames.length === 0) return 'Every receiver has the link: every pin follows the controls.';
  const one = lostNames.length === 1;
  const others = lostNames.length < receivers ? ' The other receivers keep the link and follow the controls.' : '';
  return `${lostNames.join(' and ')} ${one ? 'has' : 'have'} lost the link: ${one ? 'its' : 'their'} pins send their failsafe; a pin that holds keeps the pulse it had, and a receiver default is whatever the unit was set to, which Bindery does not know.${others}`;
}

function Bench({ setup }: { setup: Setup }) {
  // The bench starts at rest (evaluation rule 8): a throttle stick at its stop, not at mid stick.
  const rest = useMemo(() => restPositions(setup), [setup]);
  const [positions, setPositions] = useState<Positions>(rest);
  const [lost, setLost] = useState<ReadonlySet<string>>(new Set());

  const controls = useMemo(() => controlsById(setup.controls), [setup]);
  const outputs = useMemo(() => evaluate(setup, positions, lost), [setup, positions, lost]);
  const functions = useMemo(() => {
    const byCh = new Map<number, string>();
    for (const channel of setup.channels) if (!byCh.has(channel.ch)) byCh.set(channel.ch, channel.function);
    return byCh;
  }, [setup]);
  const cutOn = useMemo(
    () =>
      new Set(
        setup.channels
          .filter(
            (channel) =>
              channel.cut && switchPositionOf(controls, channel.cut.control, positions) === channel.cut.position,
          )
          .map((channel) => channel.ch),
      ),
    [setup, controls, positions],
  );
  const curves = useMemo(
    () =>
      setup.mixes.map((mix, index) => {
        const x = valueOf(controls, mix.from, positions);
        const weight = mixWeight(mix, controls, positions);
        const control = controls.get(mix.from);
        return {
          key: `${mix.id}-${index}`,
          mix,
          weight,
          points: mixCurve(setup, mix.id, 41, positions),
          now: { x, y: weight * expoCurve(x / 100, mix.expo) + mix.offset },
          active: mixIsActive(mix, controls, positions),
          inputName: control ? controlName(control) : mix.from,
        };
      }),
    [setup, controls, positions],
  );
  const atRest = setup.controls.every((control) => (positions[control.id] ?? 0) === (rest[control.id] ?? 0));
  const lostNames = setup.receivers.filter((receiver) => lost.has(receiver.id)).map(receiverName);

  return (
    <div className="space-y-6">
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 md:grid-cols-[16rem_minmax(0,1fr)] lg:grid-cols-[20rem_minmax(0,1fr)]">
        <div className="space-y-3">
          <Button variant="secondary" className="min-h-11 w-full" disabled={atRest} onClick={() => setPositions(rest)}>
            Put everything at rest
          </Button>
          <p className="text-xs text-ink-700">
            At rest: each throttle at its stop, the other sticks and knobs centred, every switch at position 0.
          </p>
          <ControlPanel
            controls={setup.controls}
            positions={positions}
            onChange={(id, value) => setPositions((current) => ({ ...current, [id]: value }))}
          />
        </div>
        <ChannelTable outputs={outputs.channels} plan={setup.channels} cutOn={cutOn} />
      </div>

      <section aria-labelledby="bench-receivers" className="space-y-3">
        <h2 id="bench-receivers" className="text-xl font-semibold text-ink-900">
          Receiver pins
        </h2>
        <LinkPanel receivers={setup.receivers} lost={lost} onChange={setLost} />
        <p role="status" className="text-sm text-ink-700">
          {linkStatus(lostNames, setup.receivers.length)}
        </p>
        <div className="grid grid-cols-[minmax(0,1fr)] gap-4 lg:grid-cols-2">
          {setup.receivers.map((receiver, index) => (
            <ReceiverPins
              key={`${receiver.id}-${index}`}
              receiver={receiver}
              output={outputs.receivers[index]}
              functions={functions}
            />
          ))}
        </div>
      </section>

      <section aria-labelledby="bench-curves" className="space-y-3">
        <h2 id="bench-curves" className="text-xl font-semibold text-ink-900">
          Mix curves
        </h2>
        {curves.length === 0 ? (
          <EmptyState title="No mixes">Without mixes no control moves any channel.</EmptyState>
        ) : (
          <>
            <p className="max-w-prose text-sm text-ink-700">
              Each mix's output against its input, at the rates the switches select now. The dot is where the control
              sits; a dashed curve is a mix that does not count at these switch positions.
            </p>
            <div className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-5">
              {curves.map(({ key, ...curve }) => (
                <MixCurvePlot key={key} {...curve} />
              ))}
            </div>
          </>
        )}
      </section>

      <CautionsPanel />
    </div>
  );
}
