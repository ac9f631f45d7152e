import { useDeferredValue, useState } from 'react';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import type { Id } from '../../../types/api';
import { useModelMatches } from '../api/list-models';
import type { SetupModelView } from '../types';

export interface ModelPickerProps {
  workspaceId: Id;
  value: SetupModelView | null;
  onChange: (model: SetupModelView | null) => void;
  error?: string;
  /** The words of one choice; the model's name when left out. */
  describe?: (model: SetupModelView) => string;
}

/**
 * Choose one model of a workspace: a search box the server answers, and a list of the
 * first matches. A hangar of thousands is never listed whole; typing narrows it, and a
 * model far down the alphabet is found as readily as the first.
 */
export function ModelPicker({
  workspaceId,
  value,
  onChange,
  error,
  describe = (model) => model.name,
}: ModelPickerProps) {
  const [typed, setTyped] = useState('');
  const q = useDeferredValue(typed.trim());
  const matches = useModelMatches(workspaceId, q);
  const found = matches.data?.items ?? [];
  // The chosen model stays a choice while a later search leaves it out.
  const choices = value && !found.some((model) => model.id === value.id) ? [value, ...found] : found;
  const total = matches.data?.total ?? 0;

  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <TextField
        label="Find in the hangar"
        type="search"
        value={typed}
        onChange={(event) => setTyped(event.target.value)}
        placeholder="Name, airframe or author"
        hint={
          matches.data && total > found.length
            ? `The list shows ${found.length} of ${total} matches; type more to narrow it.`
            : undefined
        }
        autoComplete="off"
      />
      <SelectField
        label="Model"
        value={value?.id ?? ''}
        onChange={(event) => onChange(choices.find((model) => model.id === event.target.value) ?? null)}
        error={error}
        disabled={matches.isPending}
      >
        <option value="">
          {matches.isPending
            ? 'Loading models…'
            : matches.isError
              ? 'The models could not be loaded'
              : found.length > 0
                ? 'Choose a model…'
                : q
                  ? `No model matches “${q}”`
                  : 'No models in this workspace'}
        </option>
        {choices.map((model) => (
          <option key={model.id} value={model.id}>
            {describe(model)}
          </option>
        ))}
      </SelectField>
    </div>
  );
}
