import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { FormAlert } from '../../../components/ui/form-alert';
import { useToast } from '../../../components/ui/toast';
import { ForkFields, useForkForm } from '../../models/components/fork-fields';
import type { RevisionSummary, SetupModelView } from '../../models/types';

/** Copies one revision into a new model in a workspace the user can edit, then opens it. */
export function ForkDialog({
  model,
  revision,
  onClose,
}: {
  model: SetupModelView;
  revision: RevisionSummary;
  onClose: () => void;
}) {
  const navigate = useNavigate();
  const toast = useToast();
  const fork = useForkForm({
    source: { modelId: model.id, modelName: model.name, number: revision.number },
    onForked: (created, source) => {
      toast({ title: `${created.model.name} created`, description: `Revision 1 is a copy of ${source}.` });
      void navigate(`/models/${created.model.id}/overview`);
    },
  });
  return (
    <Dialog
      title={`Fork revision ${revision.number}`}
      description={`A new model starts from this revision of ${model.name} and remembers where it came from.`}
      onClose={onClose}
    >
      <form noValidate onSubmit={fork.submit} className="space-y-4">
        {fork.errors.general && <FormAlert>{fork.errors.general}</FormAlert>}
        <ForkFields fork={fork} />
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" pending={fork.pending} disabled={fork.writable.length === 0}>
            Fork
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
