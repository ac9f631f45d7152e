import { useMemo, useState, type ReactNode } from 'react';
import { Link, useParams } from 'react-router-dom';
import { ReviewStateBadge, Badge } from '../../../components/ui/badge';
import { buttonClasses } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { CheckIcon } from '../../../components/ui/icons';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { CautionsPanel } from '../../cautions/components/cautions-panel';
import { FindingsList } from '../../findings/components/findings-list';
import { useModel } from '../../models/api/get-model';
import { useAddressedRevision } from '../../models/api/use-addressed-revision';
import { RevisionPicker } from '../../bench/components/revision-picker';
import type { ChosenSetting } from '../../reviews/components/review-plan';
import { ThreadsPanel } from '../../reviews/components/threads-panel';
import { roleAtLeast } from '@shared/contract/roles';
import { CheckBadges } from '../../models/components/check-badges';
import { TimeAgo } from '../../models/components/time-ago';
import { canEdit } from '../../models/permissions';
import { clearedWords } from '../../models/cleared-words';
import type { Revision, SetupModelView } from '../../models/types';
import { buildChannelPlan, MARK_WORDS, type MarkKind } from '../channel-plan';
import { ChannelGrid } from './channel-grid';
import { MARK_ICONS } from './mark-icons';
import { ReceiverStrips } from './receiver-strips';
import { MixList, mixesOf } from './mix-list';
import { useProvenance } from '../../provenance/api/get-provenance';
import { SourceUpdatesNotice } from '../../lineage/components/source-updates-notice';

/** `/models/:id/overview`, of the latest revision or of the one `?revision=` names (number or id). */
export function OverviewScreen() {
  const { modelId = '' } = useParams();
  const model = useModel(modelId);
  const addressed = useAddressedRevision(modelId, model.data?.latest?.id);
  const revision = addressed.revision;
  const title = model.data ? `Overview · ${model.data.name}` : 'Overview';

  let body: ReactNode;
  if (model.isPending || addressed.pending) body = <LoadingState label="Loading the channel plan…" />;
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
            : 'The latest revision could not be loaded'
        }
        error={addressed.invalid ? new Error('Name a revision by its number, like ?revision=9.') : addressed.error}
        onRetry={() => void revision.refetch()}
      />
    );
  else if (revision.data && revision.data.model_id !== model.data.id)
    body = (
      <ErrorState
        title="That revision is not one of this model’s"
        error={new Error('Pick a revision of this model from the list.')}
      />
    );
  else if (!revision.data)
    body = (
      <EmptyState title="This model has no revision yet">
        Save a setup in the editor to see its channel plan here.
      </EmptyState>
    );
  else body = <Overview model={model.data} revision={revision.data} />;

  return (
    <>
      <PageHeader
        title="Overview"
        documentTitle={title}
        description="The channel plan against the receivers and their pins, what the checks found, and the cautions before flying."
        actions={
          model.data && (
            <div className="flex flex-wrap items-end gap-3">
              {revision.data && revision.data.model_id === model.data.id && (
                <RevisionPicker modelId={model.data.id} current={revision.data} latest={model.data.latest} />
              )}
              {canEdit(model.data.role) && (
                <Link to={`/models/${modelId}/edit`} className={buttonClasses('secondary')}>
                  Edit the setup
                </Link>
              )}
            </div>
          )
        }
      />
      {body}
    </>
  );
}

function Overview({ model, revision }: { model: SetupModelView; revision: Revision }) {
  const plan = useMemo(() => buildChannelPlan(revision.document, revision.findings), [revision]);
  const marksUsed = new Set(plan.rows.flatMap((row) => row.marks.map((mark) => mark.kind)));
  const provenance = useProvenance(model.id, revision.id).data;
  const canComment = roleAtLeast(model.role, 'reviewer');
  const [chosen, setChosen] = useState<ChosenSetting | null>(null);
  const isLatest = revision.id === model.latest?.id;

  return (
    <div className="space-y-8">
      {!isLatest && model.latest && (
        <p className="rounded-md border border-info-700/40 bg-info-100 px-4 py-2 text-base text-info-700">
          This is revision {revision.number}; the latest is revision {model.latest.number}.{' '}
          <Link to={`/models/${model.id}/overview`}>Show the latest</Link>
          {' · '}
          <Link to={`/models/${model.id}/sheet?revision=${revision.number}`}>
            Field sheet of revision {revision.number}
          </Link>
        </p>
      )}
      <Summary model={model} revision={revision} linkChannels={plan.linkChannels} receivers={plan.receivers.length} />
      {model.forked_from?.readable && <SourceUpdatesNotice model={model} />}

      <section aria-labelledby="plan-heading">
        <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="plan-heading" className="text-xl font-semibold text-ink-900">
            Channel plan
          </h2>
          <p className="text-sm text-ink-700">
            {plan.linkChannels === null
              ? 'The setup does not say how many channels the link carries.'
              : `The link carries ${plan.linkChannels} channels.`}
          </p>
        </div>
        {plan.rows.length === 0 ? (
          <EmptyState title="No channel plan to draw">
            This revision names no channels or receiver pins the overview can read.
          </EmptyState>
        ) : (
          <>
            <ChannelGrid plan={plan} onChoose={canComment ? setChosen : undefined} />
            {marksUsed.size > 0 && <MarkLegend kinds={[...marksUsed]} />}
          </>
        )}
      </section>

      {plan.receivers.length > 0 && (
        <section aria-labelledby="receivers-heading">
          <h2 id="receivers-heading" className="mb-3 text-xl font-semibold text-ink-900">
            Receivers and their pins
          </h2>
          <p className="-mt-2 mb-3 max-w-prose text-sm text-ink-700">
            The primary receiver is the main one bound to the transmitter; a secondary receiver is an extra one bound to
            the same transmitter for more pins, and usually leaves telemetry to the primary.
          </p>
          <p className="mb-3 text-sm text-ink-700">Hover or focus a pin or a failsafe to see which revision set it.</p>
          <ReceiverStrips plan={plan} provenance={provenance} />
        </section>
      )}

      {mixesOf(revision.document).length > 0 && (
        <section aria-labelledby="mixes-heading">
          <h2 id="mixes-heading" className="mb-3 text-xl font-semibold text-ink-900">
            Mixes
          </h2>
          <MixList document={revision.document} provenance={provenance} />
        </section>
      )}

      <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <section aria-labelledby="findings-heading">
          <h2 id="findings-heading" className="mb-1 text-xl font-semibold text-ink-900">
            Findings of revision {revision.number}
          </h2>
          <p className="mb-3 text-sm text-ink-700">Choose a finding to open its line in the editor.</p>
          <FindingsList findings={revision.findings} modelId={model.id} />
        </section>
        <CautionsPanel className="self-start" />
      </div>

      <section aria-label="Comments">
        <ThreadsPanel
          where={{ revisionId: revision.id, workspaceId: model.workspace_id }}
          canComment={canComment}
          chosen={chosen}
          onChosenChange={setChosen}
        />
      </section>
    </div>
  );
}

const LEGEND: Record<MarkKind, string> = {
  shared: 'two functions on one channel move together',
  unrouted: 'no receiver pin carries the channel',
  'beyond-link': 'the link does not carry the channel',
  'no-function': 'a pin carries a channel with no function planned',
  finding: 'another finding is about this channel or a pin carrying it; the findings below say what',
  accepted: 'a finding about this channel was accepted with a reason (see the findings)',
};

function MarkLegend({ kinds }: { kinds: MarkKind[] }) {
  return (
    <dl className="mt-3 flex flex-wrap gap-x-6 gap-y-1 text-sm text-ink-700">
      {kinds.map((kind) => {
        const Icon = MARK_ICONS[kind];
        return (
          <div key={kind} className="flex items-center gap-1.5">
            <dt className="flex items-center gap-1 font-medium text-ink-900">
              <Icon />
              {MARK_WORDS[kind]}:
            </dt>
            <dd>{LEGEND[kind]}</dd>
          </div>
        );
      })}
    </dl>
  );
}

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-sm text-ink-700">{label}</dt>
      <dd className="mt-0.5 text-base text-ink-900">{children}</dd>
    </div>
  );
}

function Summary({
  model,
  revision,
  linkChannels,
  receivers,
}: {
  model: SetupModelView;
  revision: Revision;
  linkChannels: number | null;
  receivers: number;
}) {
  const source = model.forked_from;
  return (
    <Card className="px-5 py-4">
      <dl className="grid grid-cols-2 gap-x-6 gap-y-4 sm:grid-cols-3 lg:grid-cols-6">
        <Fact label="Revision">
          <span className="font-mono">r{revision.number}</span>
          <span className="block text-sm text-ink-700">
            <TimeAgo iso={revision.created_at} />
            {revision.author && ` by ${revision.author.name}`}
          </span>
        </Fact>
        <Fact label="Airframe">
          {model.airframe ? <span className="capitalize">{model.airframe}</span> : 'not named in the setup'}
        </Fact>
        <Fact label="Link">{linkChannels === null ? 'not named in the setup' : `${linkChannels} channels`}</Fact>
        <Fact label="Receivers">{receivers}</Fact>
        <Fact label="Checks">
          <CheckBadges errors={revision.error_count} warnings={revision.warning_count} />
        </Fact>
        <Fact label="Review">
          {revision.id !== model.latest?.id ? (
            <span className="text-base">
              {model.approved?.id === revision.id ? (
                <Badge tone="moss" icon={CheckIcon}>
                  Approved, cleared to fly
                </Badge>
              ) : (
                (clearedWords(model) ?? 'Not the approved revision')
              )}
            </span>
          ) : (
            <span className="flex flex-wrap gap-1">
              <ReviewStateBadge state={model.review_state} />
              {model.cleared_for_maiden && (
                <Badge tone="moss" icon={CheckIcon}>
                  Cleared for maiden
                </Badge>
              )}
              {!model.cleared_for_maiden && clearedWords(model) && (
                <span className="block w-full text-sm text-ink-700">{clearedWords(model)}</span>
              )}
            </span>
          )}
        </Fact>
      </dl>
      {revision.message && (
        <p className="mt-4 border-t border-ply-100 pt-3 text-sm text-ink-700">“{revision.message}”</p>
      )}
      {source && (
        <p className="mt-3 border-t border-ply-100 pt-3 text-sm text-ink-700">
          Forked from{' '}
          {source.readable && source.model_name ? (
            <Link to={`/models/${source.model_id}/overview`}>
              {source.model_name}, revision {source.number}
            </Link>
          ) : (
            `revision ${source.number} of a model in a workspace you are not in`
          )}
          {source.readable && model.latest && (
            <>
              {' · '}
              <Link to={`/models/${model.id}/compare?from=${source.revision_id}&to=${model.latest.id}`}>
                Compare with the source
              </Link>
            </>
          )}
        </p>
      )}
    </Card>
  );
}
