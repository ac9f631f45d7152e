import { useId } from 'react';
import type { Receiver } from '@shared/format/schema';
import { Button } from '../../../components/ui/button';
import { cx } from '../../../lib/cx';

export interface LinkPanelProps {
  receivers: readonly Receiver[];
  lost: ReadonlySet<string>;
  onChange: (lost: ReadonlySet<string>) => void;
}

export const receiverName = (receiver: Pick<Receiver, 'id' | 'label'>) => receiver.label ?? receiver.id;

/**
 * Which receivers have lost the link (evaluation rule 9). The case a model with two
 * receivers is built around is one unit losing the link while the other keeps it, so
 * each receiver has its own switch; losing them all is one press.
 */
export function LinkPanel({ receivers, lost, onChange }: LinkPanelProps) {
  const legendId = useId();
  const toggle = (id: string, isLost: boolean) => {
    const next = new Set(lost);
    if (isLost) next.add(id);
    else next.delete(id);
    onChange(next);
  };
  const allLost = receivers.length > 0 && receivers.every((receiver) => lost.has(receiver.id));
  return (
    <fieldset aria-labelledby={legendId} className="space-y-2">
      <legend id={legendId} className="text-base font-semibold text-ink-900">
        Link
      </legend>
      <div className="flex flex-wrap gap-2">
        {receivers.map((receiver) => (
          <label
            key={receiver.id}
            className={cx(
              'flex min-h-11 cursor-pointer items-center gap-2 rounded-md border px-3 text-sm font-medium text-ink-900',
              'border-ply-500 bg-paper-raised has-checked:border-caution-700 has-checked:bg-caution-100',
              'has-focus-visible:outline-3 has-focus-visible:outline-accent-600',
            )}
          >
            <input
              type="checkbox"
              checked={lost.has(receiver.id)}
              onChange={(event) => toggle(receiver.id, event.target.checked)}
              className="h-5 w-5 accent-caution-700"
            />
            {receiverName(receiver)} loses the link
          </label>
        ))}
        <Button
          variant="secondary"
          className="min-h-11"
          onClick={() => onChange(allLost ? new Set() : new Set(receivers.map((receiver) => receiver.id)))}
        >
          {allLost ? 'Bring the link back' : 'Lose every receiver'}
        </Button>
      </div>
    </fieldset>
  );
}
