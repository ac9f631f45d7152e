import type { MergeConflict, MergeSide } from '@shared/lineage/merge-setups';

const valueText = (value: unknown): string =>
  value === null ? 'not there (removed)' : typeof value === 'string' ? value : JSON.stringify(value);

/**
 * The settings both sides changed differently, each with what it was and what each
 * side has now, and a choice of the side to keep. Used by a fork taking in its source
 * and by an editor tab bringing its edits onto a newer revision.
 */
export function ConflictChoices({
  conflicts,
  choices,
  onChoose,
  oursLabel,
  theirsLabel,
}: {
  conflicts: readonly MergeConflict[];
  choices: Readonly<Record<string, MergeSide>>;
  onChoose: (path: string, side: MergeSide) => void;
  oursLabel: string;
  theirsLabel: string;
}) {
  return (
    <ol className="space-y-3">
      {conflicts.map((conflict) => (
        <li key={conflict.path} className="rounded-md border border-caution-700/40 bg-paper-raised px-4 py-3">
          <fieldset>
            <legend className="font-mono text-sm font-semibold break-all text-ink-900">{conflict.path}</legend>
            <p className="mt-1 text-sm text-ink-700">
              Was <code className="font-mono">{valueText(conflict.base)}</code>; both sides changed it.
            </p>
            <div className="mt-2 grid gap-2 sm:grid-cols-2">
              {(['ours', 'theirs'] as const).map((side) => (
                <label
                  key={side}
                  className="flex cursor-pointer items-start gap-2 rounded-sm border border-ply-300 px-3 py-2 text-sm has-[:checked]:border-ink-900 has-[:checked]:bg-ply-100"
                >
                  <input
                    type="radio"
                    name={`side-${conflict.path}`}
                    value={side}
                    checked={choices[conflict.path] === side}
                    onChange={() => onChoose(conflict.path, side)}
                    className="mt-1"
                  />
                  <span>
                    <span className="block font-medium text-ink-900">
                      Keep {side === 'ours' ? oursLabel : theirsLabel}
                    </span>
                    <code className="block font-mono break-all text-ink-700">
                      {valueText(side === 'ours' ? conflict.ours : conflict.theirs)}
                    </code>
                  </span>
                </label>
              ))}
            </div>
          </fieldset>
        </li>
      ))}
    </ol>
  );
}
