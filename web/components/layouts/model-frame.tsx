import { Suspense } from 'react';
import { Link, Outlet, useParams } from 'react-router-dom';
import { useCurrentWorkspace } from '../../features/workspaces/hooks/use-current-workspace';
import { LoadingState } from '../ui/loading-state';
import { NavTabs } from './nav-tabs';
import type { FrameLink } from './app-frame';

/** A model's screens under one sub-navigation, so moving between them keeps the place. */
export function ModelFrame({ links }: { links: FrameLink[] }) {
  const { modelId = '' } = useParams();
  const { fallback } = useCurrentWorkspace();
  const base = `/models/${encodeURIComponent(modelId)}`;

  return (
    <div>
      <p className="text-sm text-ink-700">
        {fallback ? <Link to={`/w/${fallback.id}/hangar`}>Hangar</Link> : 'Hangar'}
        <span aria-hidden="true" className="px-1.5 text-ink-500">/</span>
        <span>Model {modelId}</span>
      </p>
      <NavTabs
        label="Model"
        className="mt-2 mb-6 border-b border-ply-200"
        items={links.map((link) => ({ to: `${base}/${link.path}`, label: link.label }))}
      />
      <Suspense fallback={<LoadingState />}>
        <Outlet />
      </Suspense>
    </div>
  );
}
