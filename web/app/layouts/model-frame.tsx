import { Suspense } from 'react';
import { Link, Outlet, useParams } from 'react-router-dom';
import { useSession } from '../../features/auth/hooks/use-session';
import { KeepForField } from '../../features/field-kit/components/keep-for-field';
import { useModel } from '../../features/models/api/get-model';
import { useCurrentWorkspace } from '../../features/workspaces/hooks/use-current-workspace';
import { Badge } from '../../components/ui/badge';
import { LoadingState } from '../../components/ui/loading-state';
import { NavTabs } from '../../components/layouts/nav-tabs';
import type { FrameLink } from './app-frame';

/** A model's screens under one sub-navigation, so moving between them keeps the place. */
export function ModelFrame({ links }: { links: FrameLink[] }) {
  const { modelId = '' } = useParams();
  const model = useModel(modelId);
  const { workspaces } = useSession();
  const { fallback } = useCurrentWorkspace();
  const base = `/models/${encodeURIComponent(modelId)}`;
  const workspace = (model.data && workspaces.find((ws) => ws.id === model.data.workspace_id)) || fallback;
  const latest = model.data?.latest;

  return (
    <div>
      <nav aria-label="Breadcrumb" className="text-sm text-ink-700">
        {workspace ? <Link to={`/w/${workspace.id}/hangar`}>{workspace.name} hangar</Link> : 'Hangar'}
        <span aria-hidden="true" className="px-1.5 text-ink-500">
          /
        </span>
        <span>{model.data?.name ?? 'Model'}</span>
      </nav>
      {model.data && (
        <div className="mt-1 flex flex-wrap items-baseline gap-x-3 gap-y-1">
          <p className="text-xl font-semibold tracking-tight text-ink-900">{model.data.name}</p>
          {model.data.archived_at && (
            <Link to={`${base}/settings`} className="no-underline">
              <Badge>Archived</Badge>
            </Link>
          )}
          {latest && (
            <span className="text-sm text-ink-700">
              Revision {latest.number}
              {latest.author && ` by ${latest.author.name}`}
            </span>
          )}
        </div>
      )}
      {model.data?.latest && <KeepForField modelId={model.data.id} />}
      <NavTabs
        label="Model"
        className="mt-2 mb-6 border-b border-ply-200"
        items={links.map((link) => ({ to: `${base}/${link.path}`, label: link.label }))}
      />
      {/* Each screen reads the same model query and shows its own loading and error states. */}
      <Suspense fallback={<LoadingState />}>
        <Outlet />
      </Suspense>
    </div>
  );
}
