import { useState } from 'react';
import type { ClubRulesView } from '@shared/contract/club-rules';
import { RULE_SEVERITIES, type ClubRules, type RuleSeverity } from '@shared/rules/club-rules';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { ErrorState } from '../../../components/ui/error-state';
import { FormAlert } from '../../../components/ui/form-alert';
import { LoadingState } from '../../../components/ui/loading-state';
import type { Id } from '../../../types/api';
import { exactTime } from '../../models/format-time';
import { useClubRules, useSaveClubRules } from '../api/club-rules';

const SEVERITY_WORDS: Record<RuleSeverity, string> = {
  error: 'error (do not fly)',
  warning: 'warning',
  // The format's severity `info` is a note on every screen.
  info: 'note',
  off: 'off (not checked)',
};

const SHORT_WORDS: Record<string, string> = { info: 'note' };

// An error is never lowered: its only choice is to stay an error.
const choicesFor = (own: string): RuleSeverity[] => (own === 'error' ? ['error'] : [...RULE_SEVERITIES]);

function changesBetween(before: ClubRules, after: ClubRules, defaults: Record<string, string>): string[] {
  const lines: string[] = [];
  const ids = new Set([...Object.keys(before.severities), ...Object.keys(after.severities)]);
  for (const id of [...ids].sort()) {
    const from = before.severities[id] ?? defaults[id];
    const to = after.severities[id] ?? defaults[id];
    if (from !== to) lines.push(`${id}: ${SHORT_WORDS[from] ?? from} → ${SHORT_WORDS[to] ?? to}`);
  }
  const a = before.approvals;
  const b = after.approvals;
  if (a.default !== b.default) lines.push(`approvals needed: ${a.default} → ${b.default}`);
  if (a.heavy_weight_g !== b.heavy_weight_g || a.heavy !== b.heavy)
    lines.push(
      `heavy models: ${b.heavy_weight_g === null ? 'no weight limit' : `over ${b.heavy_weight_g} g need ${b.heavy}`}`,
    );
  if (a.turbine !== b.turbine) lines.push(`turbines: ${a.turbine} → ${b.turbine} approvals`);
  if (a.named_reviewers_only !== b.named_reviewers_only)
    lines.push(b.named_reviewers_only ? 'only named reviewers approve' : 'any reviewer may approve');
  return lines.length > 0 ? lines : ['no change'];
}

/** The club's rules on the Team screen: every member reads them and their history; owners change them. */
export function ClubRulesPanel({ workspaceId, owner }: { workspaceId: Id; owner: boolean }) {
  const rules = useClubRules(workspaceId);
  if (rules.isPending) return <LoadingState label="Loading the club rules…" />;
  if (rules.isError)
    return (
      <ErrorState title="The club rules could not be loaded" error={rules.error} onRetry={() => void rules.refetch()} />
    );
  return (
    <RulesForm key={rules.data.updated_at ?? 'defaults'} view={rules.data} workspaceId={workspaceId} owner={owner} />
  );
}

function RulesForm({ view, workspaceId, owner }: { view: ClubRulesView; workspaceId: Id; owner: boolean }) {
  const [severities, setSeverities] = useState<Record<string, RuleSeverity>>(view.severities);
  const [approvals, setApprovals] = useState(view.approvals);
  const [pick, setPick] = useState('');
  const save = useSaveClubRules(workspaceId);
  const checks = Object.keys(view.defaults).sort();
  const changed = Object.keys(severities).sort();
  const number = (value: string, fallback: number) => {
    const parsed = Number(value);
    return Number.isInteger(parsed) ? parsed : fallback;
  };
  const countField = (label: string, key: 'default' | 'heavy' | 'turbine') => (
    <label className="block text-sm text-ink-700">
      {label}
      <select
        disabled={!owner}
        value={approvals[key]}
        onChange={(event) => setApprovals({ ...approvals, [key]: number(event.target.value, approvals[key]) })}
        className="mt-1 block h-10 w-full rounded-md border border-ply-500 bg-paper-raised px-2 text-base text-ink-900"
      >
        {[1, 2, 3].map((n) => (
          <option key={n} value={n}>
            {n}
          </option>
        ))}
      </select>
    </label>
  );

  return (
    <Card className="px-5 py-4">
      <h2 id="rules-heading" className="text-xl font-semibold text-ink-900">
        Club rules
      </h2>
      <p className="mt-1 max-w-prose text-sm text-ink-700">
        Every check, compare, review, hangar count and field sheet in this workspace follows these rules. A club may
        raise any check and lower warnings and notes; an error is never lowered, as errors mean “do not fly”. Local
        rules and your national model-flying body come first.
      </p>

      <h3 className="mt-4 text-base font-semibold text-ink-900">Checks the club sets</h3>
      {changed.length === 0 ? (
        <p className="mt-1 text-sm text-ink-700">Every check keeps the severity docs/format.md gives it.</p>
      ) : (
        <ul className="mt-2 space-y-2" aria-label="Checks the club sets">
          {changed.map((id) => (
            <li key={id} className="flex flex-wrap items-center gap-3 text-sm">
              <code className="min-w-48 font-mono text-ink-900">{id}</code>
              <span className="text-ink-700">its own: {view.defaults[id]}</span>
              <label className="flex items-center gap-2">
                <span className="sr-only">Severity of {id}</span>
                <select
                  disabled={!owner}
                  value={severities[id]}
                  onChange={(event) => setSeverities({ ...severities, [id]: event.target.value as RuleSeverity })}
                  className="h-9 rounded-md border border-ply-500 bg-paper-raised px-2 text-ink-900"
                >
                  {choicesFor(view.defaults[id]).map((severity) => (
                    <option key={severity} value={severity}>
                      {SEVERITY_WORDS[severity]}
                    </option>
                  ))}
                </select>
              </label>
              {owner && (
                <Button
                  size="sm"
                  variant="quiet"
                  onClick={() =>
                    setSeverities(Object.fromEntries(Object.entries(severities).filter(([k]) => k !== id)))
                  }
                >
                  Back to its own
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
      {owner && (
        <div className="mt-3 flex flex-wrap items-end gap-2">
          <label className="block text-sm text-ink-700">
            Set another check
            <select
              value={pick}
              onChange={(event) => setPick(event.target.value)}
              className="mt-1 block h-10 rounded-md border border-ply-500 bg-paper-raised px-2 text-base text-ink-900"
            >
              <option value="">Choose a check…</option>
              {checks
                .filter((id) => !severities[id] && view.defaults[id] !== 'error')
                .map((id) => (
                  <option key={id} value={id}>
                    {id} ({view.defaults[id]})
                  </option>
                ))}
            </select>
          </label>
          <Button
            variant="secondary"
            disabled={!pick}
            onClick={() => {
              setSeverities({ ...severities, [pick]: 'error' });
              setPick('');
            }}
          >
            Add
          </Button>
        </div>
      )}

      <h3 className="mt-5 text-base font-semibold text-ink-900">Sign-off</h3>
      <div className="mt-2 grid max-w-2xl gap-3 sm:grid-cols-2">
        {countField('Approvals needed', 'default')}
        <label className="block text-sm text-ink-700">
          Heavy above (grams; empty for no limit)
          <input
            disabled={!owner}
            inputMode="numeric"
            value={approvals.heavy_weight_g ?? ''}
            onChange={(event) =>
              setApprovals({
                ...approvals,
                heavy_weight_g: event.target.value.trim() === '' ? null : number(event.target.value, 0),
              })
            }
            className="mt-1 block h-10 w-full rounded-md border border-ply-500 bg-paper-raised px-3 text-base text-ink-900"
          />
        </label>
        {countField('Approvals for a heavy model', 'heavy')}
        {countField('Approvals for a turbine model', 'turbine')}
        <label className="flex items-center gap-2 text-sm text-ink-900 sm:col-span-2">
          <input
            type="checkbox"
            disabled={!owner}
            checked={approvals.named_reviewers_only}
            onChange={(event) => setApprovals({ ...approvals, named_reviewers_only: event.target.checked })}
          />
          Only the reviewers named on a review may approve it
        </label>
      </div>

      {save.error && (
        <div className="mt-3">
          <FormAlert>{save.error.message}</FormAlert>
        </div>
      )}
      {owner && (
        <Button className="mt-4" disabled={save.isPending} onClick={() => save.mutate({ severities, approvals })}>
          Save the rules
        </Button>
      )}

      <h3 className="mt-6 text-base font-semibold text-ink-900">Changes to the rules</h3>
      {view.history.length === 0 ? (
        <p className="mt-1 text-sm text-ink-700">The rules have not been changed.</p>
      ) : (
        <ol className="mt-2 space-y-1 text-sm text-ink-900" aria-label="Changes to the rules">
          {view.history.map((entry, index) => (
            <li key={`${entry.at}-${index}`}>
              <span className="text-ink-700">{exactTime(entry.at)}</span> · {entry.actor?.name ?? 'Someone'}:{' '}
              {changesBetween(entry.before, entry.after, view.defaults).join('; ')}
            </li>
          ))}
        </ol>
      )}
    </Card>
  );
}
