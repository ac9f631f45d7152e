import { useNavigate } from 'react-router-dom';
import { Dialog } from '../../../components/ui/dialog';
import { useToast } from '../../../components/ui/toast';
import type { WorkspaceMembership } from '../../../types/api';
import { useAddReceiver } from '../api/change-receiver';
import { ReceiverFieldsForm } from './receiver-fields-form';

export function AddReceiverDialog({ workspace, onClose }: { workspace: WorkspaceMembership; onClose: () => void }) {
  const add = useAddReceiver(workspace.id);
  const navigate = useNavigate();
  const toast = useToast();
  return (
    <Dialog
      title="Add a receiver to the shelf"
      description="Its settings can be recorded on its own page, or applied from a model's setup once it is installed as one of its receivers."
      onClose={onClose}
    >
      <ReceiverFieldsForm
        submitLabel="Add to the shelf"
        pending={add.isPending}
        error={add.error}
        onCancel={onClose}
        onSubmit={(values) =>
          add.mutate(
            { ...values, notes: values.notes || undefined },
            {
              onSuccess: (unit) => {
                toast({ title: `${unit.label} is on the shelf` });
                void navigate(`/w/${workspace.id}/shelf/${unit.id}`);
              },
            },
          )
        }
      />
    </Dialog>
  );
}
