import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import type { Role } from '../../../types/api';
import { useSession } from '../../auth/hooks/use-session';
import { useModel } from '../../models/api/get-model';
import { useRevision } from '../../models/api/get-revision';
import { canEdit } from '../../models/permissions';
import type { SetupModelView } from '../../models/types';
import { clearDraft, loadDraft } from '../draft-storage';
import { SetupEditor } from './setup-editor';

export function EditScreen() {
  const { modelId = '' } = useParams();
  const model = useModel(modelId);
  const { workspaces } = useSession();

  if (model.isPending) return <LoadingState label="Loading the model…" />;
  if (model.isError) {
    return (
      <ErrorState title="This model could not be loaded" error={model.error} onRetry={() => void model.refetch()} />
    );
  }
  if (!model.data.latest) {
    return (
      <>
        <PageHeader title="Edit" documentTitle={`Edit · ${model.data.name}`} />
        <EmptyState title="No revision to edit">This model has no saved setup yet.</EmptyState>
      </>
    );
  }
  // The role in the model's workspace as the session knows it; the model's own answer
  // covers a workspace joined since the session was loaded.
  const role = workspaces.find((workspace) => workspace.id === model.data.workspace_id)?.role ?? model.data.role;
  return <EditorLoader key={model.data.id} model={model.data} role={role} canEdit={canEdit(role)} />;
}

interface Start {
  revisionId: string;
  draftText: string | null;
}

/**
 * Picks the revision the edit stands on once: this tab's draft's base when there is a
 * draft, else the latest. Later news about the model (a save of ours, someone else's)
 * does not swap the text under the pilot's hands.
 */
function EditorLoader({ model, role, canEdit }: { model: SetupModelView; role: Role; canEdit: boolean }) {
  const latestId = model.latest?.id ?? '';
  const [start, setStart] = useState<Start>(() => {
    const draft = canEdit ? loadDraft(model.id) : null;
    return { revisionId: draft?.baseId ?? latestId, draftText: draft?.text ?? null };
  });
  const revision = useRevision(start.revisionId);

  if (revision.isPending) return <LoadingState label="Loading the setup…" />;
  if (revision.isError) {
    return (
      <div className="space-y-4">
        <ErrorState
          title="The setup could not be loaded"
          error={revision.error}
          onRetry={() => void revision.refetch()}
        />
        {start.draftText !== null && (
          <div className="text-center">
            <Button
              variant="secondary"
              onClick={() => {
                clearDraft(model.id);
                setStart({ revisionId: latestId, draftText: null });
              }}
            >
              Drop this tab’s draft and open the latest revision
            </Button>
          </div>
        )}
      </div>
    );
  }
  const base = revision.data;
  return (
    <SetupEditor
      model={model}
      role={role}
      canEdit={canEdit}
      initialBase={{ id: base.id, number: base.number, yaml: base.yaml, document: base.document }}
      restoredText={start.draftText}
    />
  );
}
