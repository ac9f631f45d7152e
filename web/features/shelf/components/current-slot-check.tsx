import { Button } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { useToast } from '../../../components/ui/toast';
import { useApplySettings } from '../api/change-receiver';
import { useReuseCheck } from '../api/get-reuse-check';
import type { ShelfUnit } from '../types';
import { ReuseChecklist } from './reuse-checklist';

/** The installed unit against its slot in the model's latest revision, ending in "I have applied these settings". */
export function CurrentSlotCheck({
  unit,
  editor,
}: {
  unit: ShelfUnit & { installed: NonNullable<ShelfUnit['installed']> };
  editor: boolean;
}) {
  const check = useReuseCheck(unit.id, { modelId: unit.installed.model.id, slot: unit.installed.slot });
  const apply = useApplySettings(unit.id);
  const toast = useToast();

  if (check.isPending) return <LoadingState label="Checking the unit against the receiver it is installed as…" />;
  if (check.isError)
    return (
      <ErrorState title="The reuse check could not run" error={check.error} onRetry={() => void check.refetch()} />
    );
  const blocked = check.data.notes.some((note) => note.blocking);

  return (
    <ReuseChecklist
      check={check.data}
      tickable={editor}
      action={(allTicked) =>
        check.data.ready || blocked || !editor ? null : (
          <>
            <Button
              disabled={!allTicked}
              pending={apply.isPending}
              onClick={() =>
                apply.mutate(
                  { revision: check.data.revision.id },
                  {
                    onSuccess: () =>
                      toast({
                        title: 'Settings recorded',
                        description: `${unit.label} now holds what receiver ${unit.installed.slot} of the setup asks for.`,
                      }),
                    onError: () => void check.refetch(),
                  },
                )
              }
            >
              I have applied these settings
            </Button>
            {!allTicked && <p className="text-sm text-ink-700">Tick every change once it is programmed on the unit.</p>}
            {apply.error && (
              <p role="alert" className="w-full text-sm text-danger-700">
                {apply.error.message}
              </p>
            )}
          </>
        )
      }
    />
  );
}
