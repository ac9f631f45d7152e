import { SelectField } from '../../../components/ui/select-field';
import type { RevisionSummary } from '../../models/types';

export interface RevisionGroup {
  label: string;
  revisions: RevisionSummary[];
}

export interface RevisionPickerProps {
  label: string;
  value: string;
  groups: RevisionGroup[];
  /** The revision shown now, when it is not among the loaded ones (an old one named in the address). */
  current?: { id: string; text: string } | null;
  onChange: (id: string) => void;
}

const optionText = (revision: RevisionSummary) =>
  `r${revision.number}${revision.message ? `: ${revision.message.slice(0, 50)}` : ''}${revision.tags.length ? ` [${revision.tags.join(', ')}]` : ''}`;

export function RevisionPicker({ label, value, groups, current, onChange }: RevisionPickerProps) {
  const known = groups.some((group) => group.revisions.some((revision) => revision.id === value));
  return (
    <SelectField label={label} value={value} onChange={(event) => onChange(event.target.value)}>
      {!value && <option value="">Choose a revision</option>}
      {!known && value && current && <option value={current.id}>{current.text}</option>}
      {groups.map((group) => (
        <optgroup key={group.label} label={group.label}>
          {group.revisions.map((revision) => (
            <option key={revision.id} value={revision.id}>
              {optionText(revision)}
            </option>
          ))}
        </optgroup>
      ))}
    </SelectField>
  );
}
