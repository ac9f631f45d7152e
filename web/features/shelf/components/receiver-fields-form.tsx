import { useState, type FormEvent } from 'react';
import { MARK_COLOURS, type MarkColour } from '@shared/reuse/receiver-fields';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { SelectField } from '../../../components/ui/select-field';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { TextField } from '../../../components/ui/text-field';
import { isApiError } from '../../../lib/api-client';

export interface ReceiverFieldValues {
  label: string;
  mark: string | null;
  mark_colour: MarkColour | null;
  outputs: number;
  notes: string;
}

export interface ReceiverFieldsFormProps {
  initial?: Partial<ReceiverFieldValues>;
  submitLabel: string;
  pending: boolean;
  error: unknown;
  onSubmit: (values: ReceiverFieldValues) => void;
  onCancel: () => void;
}

/** A unit's shelf record: label, the mark on its case, how many outputs it has, notes. */
export function ReceiverFieldsForm({
  initial = {},
  submitLabel,
  pending,
  error,
  onSubmit,
  onCancel,
}: ReceiverFieldsFormProps) {
  const [label, setLabel] = useState(initial.label ?? '');
  const [mark, setMark] = useState(initial.mark ?? '');
  const [colour, setColour] = useState<string>(initial.mark_colour ?? '');
  const [outputs, setOutputs] = useState(String(initial.outputs ?? 8));
  const [notes, setNotes] = useState(initial.notes ?? '');
  const fields = isApiError(error) ? error.fields : {};
  const general =
    error && Object.keys(fields).length === 0 ? (error instanceof Error ? error.message : 'That did not work.') : null;

  function submit(event: FormEvent) {
    event.preventDefault();
    onSubmit({
      label: label.trim(),
      mark: mark.trim() || null,
      mark_colour: (colour || null) as MarkColour | null,
      outputs: Number(outputs),
      notes: notes.trim(),
    });
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-4">
      {general && <FormAlert>{general}</FormAlert>}
      <TextField
        label="Label"
        value={label}
        onChange={(event) => setLabel(event.target.value)}
        error={fields.label}
        required
        maxLength={80}
        data-autofocus
        hint="How the club knows this unit, e.g. “Kestrel wing unit”."
      />
      <div className="grid gap-4 sm:grid-cols-[1fr_11rem]">
        <TextField
          label="Mark on the case"
          value={mark}
          onChange={(event) => setMark(event.target.value)}
          error={fields.mark}
          maxLength={80}
          placeholder="Red tape, two stripes"
        />
        <SelectField
          label="Mark colour"
          value={colour}
          onChange={(event) => setColour(event.target.value)}
          error={fields.mark_colour}
        >
          <option value="">No colour</option>
          {MARK_COLOURS.map((name) => (
            <option key={name} value={name}>
              {name[0].toUpperCase() + name.slice(1)}
            </option>
          ))}
        </SelectField>
      </div>
      <TextField
        label="Outputs"
        type="number"
        inputMode="numeric"
        min={1}
        max={32}
        value={outputs}
        onChange={(event) => setOutputs(event.target.value)}
        error={fields.outputs}
        className="max-w-40"
      />
      <TextAreaField
        label="Notes"
        value={notes}
        onChange={(event) => setNotes(event.target.value)}
        error={fields.notes}
        maxLength={2000}
      />
      <div className="flex justify-end gap-2 pt-2">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" pending={pending}>
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}
