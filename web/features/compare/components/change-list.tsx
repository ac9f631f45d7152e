import type { Change, ChangeCounts, ChangeKind, Section } from '@shared/diff/types';
import { CHANGE_KINDS } from '@shared/diff/types';
import { Badge } from '../../../components/ui/badge';
import { Card } from '../../../components/ui/card';
import { groupChanges, KIND_WORDS, SECTION_NAMES, valueText } from '../group-changes';

type Tone = 'moss' | 'danger' | 'caution' | 'accent' | 'neutral';
const KIND_TONES: Record<ChangeKind, Tone> = {
  added: 'moss',
  removed: 'danger',
  changed: 'caution',
  renamed: 'accent',
  moved: 'neutral',
};
const KIND_SIGNS: Record<ChangeKind, string> = { added: '+', removed: '−', changed: '~', renamed: '→', moved: '↕' };

export function KindBadge({ kind, count }: { kind: ChangeKind; count?: number }) {
  return (
    <Badge tone={KIND_TONES[kind]}>
      <span aria-hidden="true" className="font-mono">
        {KIND_SIGNS[kind]}
      </span>
      {count === undefined ? KIND_WORDS[kind] : `${count} ${KIND_WORDS[kind].toLowerCase()}`}
    </Badge>
  );
}

export function KindCounts({ counts }: { counts: ChangeCounts }) {
  const kinds = CHANGE_KINDS.filter((kind) => counts[kind] > 0);
  if (kinds.length === 0) return <span className="text-sm text-ink-500">no changes</span>;
  return (
    <span className="inline-flex flex-wrap gap-1">
      {kinds.map((kind) => (
        <KindBadge key={kind} kind={kind} count={counts[kind]} />
      ))}
    </span>
  );
}

/** The semantic changes grouped by section, each with its sentence, path and before -> after. */
export function ChangeList({
  changes,
  sections,
}: {
  changes: Change[];
  sections: Partial<Record<Section, ChangeCounts>>;
}) {
  const { changed, unchanged } = groupChanges(changes, sections);
  if (changed.length === 0) {
    return (
      <p className="rounded-lg border border-ply-200 bg-paper-raised px-4 py-3 text-base text-ink-700">
        The two revisions describe the same setup: no section differs.
      </p>
    );
  }
  return (
    <div className="space-y-3">
      {changed.map((group) => (
        <Card key={group.section} className="overflow-hidden">
          <details open>
            <summary className="flex cursor-pointer flex-wrap items-center gap-x-3 gap-y-1 border-b border-ply-100 bg-paper px-4 py-2.5">
              <h3 className="text-base font-semibold text-ink-900">{SECTION_NAMES[group.section]}</h3>
              <span className="text-sm text-ink-700">
                {group.total} {group.total === 1 ? 'change' : 'changes'}
              </span>
              <KindCounts counts={group.counts} />
            </summary>
            <ul className="divide-y divide-ply-100">
              {group.changes.map((change, index) => (
                <li
                  key={`${change.path}-${change.kind}-${index}`}
                  className="flex flex-wrap items-start gap-x-3 gap-y-1 px-4 py-2.5"
                >
                  <span className="w-24 shrink-0 pt-0.5">
                    <KindBadge kind={change.kind} />
                  </span>
                  <div className="min-w-0 flex-1">
                    <p className="text-base text-ink-900">{change.summary}</p>
                    <p className="mt-0.5 flex flex-wrap items-baseline gap-x-2 text-sm text-ink-700">
                      <code className="font-mono break-all text-ink-500">{change.path}</code>
                      {change.kind !== 'moved' && (
                        <span className="font-mono [overflow-wrap:anywhere]">
                          {valueText(change.before)} <span aria-label="becomes">-&gt;</span> {valueText(change.after)}
                        </span>
                      )}
                    </p>
                  </div>
                </li>
              ))}
            </ul>
          </details>
        </Card>
      ))}
      {unchanged.length > 0 && (
        <p className="px-1 text-sm text-ink-700">
          Unchanged: {unchanged.map((section) => SECTION_NAMES[section]).join(', ')}.
        </p>
      )}
    </div>
  );
}
