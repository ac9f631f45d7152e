import { Suspense, useCallback, useEffect, useId, useMemo, useRef, useState, type ChangeEvent } from 'react';
import { Link, useLocation, useSearchParams } from 'react-router-dom';
import { analyzeSetup } from '@shared/analyze';
import { countFindings, type Finding } from '@shared/findings';
import { applyClubRules, DEFAULT_CLUB_RULES } from '@shared/rules/club-rules';
import { lazyScreen } from '../../../app/lazy-screen';
import { Badge, SeverityBadge } from '../../../components/ui/badge';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { CheckIcon, InfoIcon, PencilIcon, StaleIcon, WarningIcon } from '../../../components/ui/icons';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { Spinner } from '../../../components/ui/spinner';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import type { Role } from '../../../types/api';
import { AcceptFindingDialog } from '../../findings/components/accept-finding-dialog';
import { FindingsList } from '../../findings/components/findings-list';
import { countWords, someCountWords } from '../../findings/count-words';
import type { Revision, SavedRevision, SetupModelView } from '../../models/types';
import { staleBaseOf, useSaveRevision, type StaleBase } from '../api/save-revision';
import { applyEdits, readDocumentData, type DocumentEdit } from '@shared/edit/document-edits';
import { clearDraft, saveDraft } from '../draft-storage';
import { useDebouncedValue } from '../hooks/use-debounced-value';
import { ChannelPlanForm } from './channel-plan-form';
import { ControlsLinkForm } from './controls-link-form';
import { LeaveGuard } from './leave-guard';
import { MixesForm } from './mixes-form';
import { Notice } from './notice';
import { PinMapForms } from './pin-map-form';
import { SaveDialog, type SaveSignOff } from './save-dialog';
import { useRevisionThreads } from '../../reviews/api/reviews';
import { useClubRules } from '../../team/api/club-rules';
import { useProvenance } from '../../provenance/api/get-provenance';
import { cursorOriginText, lineOrigins } from '../line-origins';
import { settingWords } from '../../reviews/setting-words';
import type { CommentThread } from '../../reviews/types';
import { commentLines, type CommentLine } from '../comment-lines';
import { canonicalJson } from '@shared/canonical/content-hash';
import { StaleBasePanel } from './stale-base-panel';
import { EditorTabs, type EditorTab } from './editor-tabs';
import type { CursorOrigin, LineJump } from './yaml-code-editor';

const YamlCodeEditor = lazyScreen(() => import('./yaml-code-editor'), 'YamlCodeEditor');

/** The revision an edit stands on: saving names its number as the base. */
export interface EditorBase {
  id: string;
  number: number;
  yaml: string;
  /** Its plain value, for saying what changed since. */
  document: unknown;
}

export interface SetupEditorProps {
  model: SetupModelView;
  initialBase: EditorBase;
  /** The text of this tab's draft, when one was kept for this model. */
  restoredText: string | null;
  canEdit: boolean;
  role: Role;
}

// Long enough that the checks do not run between two keystrokes, short enough to feel live.
const CHECK_DELAY_MS = 250;
const MAX_FILE_BYTES = 512 * 1024;

const baseOf = (revision: Revision): EditorBase => ({
  id: revision.id,
  number: revision.number,
  yaml: revision.yaml,
  document: revision.document,
});

function fileStem(name: string): string {
  const stem = name
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  return stem || 'setup';
}

/** A file's text; FileReader, because older tablet browsers lack Blob.text(). */
function readText(file: File): Promise<string> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(typeof reader.result === 'string' ? reader.result : '');
    reader.onerror = () => reject(reader.error ?? new Error(`${file.name} could not be read.`));
    reader.readAsText(file);
  });
}

function countsSentence(saved: SavedRevision): string {
  const found = someCountWords({ errors: saved.error_count, warnings: saved.warning_count, infos: saved.info_count });
  return found === null ? 'The checks found nothing open.' : `The checks found ${found}.`;
}

/** The index of the `accepted` entry that accepts `finding`, in the text's plain value. */
function acceptedIndex(data: unknown, finding: Finding): number {
  const list = (data as { accepted?: unknown } | null)?.accepted;
  if (!Array.isArray(list)) return -1;
  return list.findIndex(
    (entry: unknown) =>
      entry !== null &&
      typeof entry === 'object' &&
      (entry as { rule?: unknown }).rule === finding.rule &&
      (entry as { path?: unknown }).path === finding.path,
  );
}

/** What saving on `base` does to the model's sign-off; null when the base holds none. */
function signOffOf(model: SetupModelView, base: EditorBase, next: unknown): SaveSignOff | null {
  if (base.id !== model.latest?.id) return null;
  const changesSettings = canonicalJson(base.document ?? null) !== canonicalJson(next ?? null);
  if (model.review_state === 'approved' && model.approved)
    return {
      kind: 'approved',
      number: base.number,
      approvers: model.approved.approvers.map((person) => person.name),
      changesSettings,
    };
  if (model.review_state === 'pending') return { kind: 'pending', number: base.number, approvers: [], changesSettings };
  return null;
}

export function SetupEditor({ model, initialBase, restoredText, canEdit, role }: SetupEditorProps) {
  const toast = useToast();
  const save = useSaveRevision(model.id);
  const [base, setBase] = useState(initialBase);
  const [text, setTextState] = useState(restoredText ?? initialBase.yaml);
  // Form edits apply to the text as it is at that moment, not as the last render saw it.
  const textRef = useRef(text);
  const setText = useCallback((next: string) => {
    textRef.current = next;
    setTextState(next);
  }, []);
  const [restored, setRestored] = useState(restoredText !== null && restoredText !== initialBase.yaml);
  const [tab, setTab] = useState<EditorTab>('text');
  const [stale, setStale] = useState<{ info: StaleBase; refused: boolean } | null>(null);
  const [saveOpen, setSaveOpen] = useState(false);
  const [discardOpen, setDiscardOpen] = useState(false);
  const [accepting, setAccepting] = useState<Finding | null>(null);
  const fileInput = useRef<HTMLInputElement>(null);
  const checksId = useId();

  const dirty = canEdit && text !== base.yaml;
  const settled = useDebouncedValue(text, CHECK_DELAY_MS);
  // The live checks rank findings by the club's rules, as the stored checks do; until
  // the rules arrive the format's own severities stand.
  const clubRules = useClubRules(model.workspace_id).data ?? DEFAULT_CLUB_RULES;
  const analysis = useMemo(() => analyzeSetup(settled), [settled]);
  const checked = useMemo(() => {
    const findings = applyClubRules(analysis.findings, clubRules);
    return { text: settled, analysis: { ...analysis, findings, counts: countFindings(findings) } };
  }, [settled, analysis, clubRules]);
  const marks = useMemo(() => ({ text: checked.text, findings: checked.analysis.findings }), [checked]);
  const checking = settled !== text;
  const { counts } = checked.analysis;

  useEffect(() => {
    if (!canEdit) return;
    if (dirty) saveDraft(model.id, { baseId: base.id, baseNumber: base.number, text });
    else clearDraft(model.id);
  }, [canEdit, dirty, model.id, base.id, base.number, text]);

  const [params, setParams] = useSearchParams();
  const location = useLocation();
  // A finding's link asks for a line with `?line=`: the request is taken once, as a
  // jump, and the address is tidied back to the editor's own, so a reload or a shared
  // link does not jump again.
  const lineParam = Number(params.get('line'));
  const requested = Number.isInteger(lineParam) && lineParam > 0 ? { line: lineParam, key: location.key } : null;
  const [jump, setJump] = useState<LineJump | null>(requested);
  if (requested && requested.key !== jump?.key) {
    setJump(requested);
    setTab('text');
  }
  useEffect(() => {
    if (!params.has('line')) return;
    setParams(
      (next) => {
        next.delete('line');
        return next;
      },
      { replace: true },
    );
  }, [params, setParams]);

  const formData = useMemo(() => (tab === 'text' ? null : readDocumentData(text)), [tab, text]);

  // Open threads of the revision the edit stands on, beside their settings' lines as the text now is.
  const threads = useRevisionThreads(base.id, 'open');
  const placed = useMemo(() => commentLines(checked.text, threads.data ?? []), [checked.text, threads.data]);
  const commentMarks = useMemo(
    () => ({
      text: checked.text,
      marks: placed.map(({ line, threads: onLine }) => ({
        line,
        title: onLine.map((thread) => `${thread.author?.name ?? 'Former member'}: ${thread.body}`).join('\n'),
      })),
    }),
    [checked.text, placed],
  );

  // "Show where each line came from": one provenance answer for the revision the edit
  // stands on, placed on the lines whose settings still hold that revision's values.
  const [showOrigins, setShowOrigins] = useState(false);
  const [cursor, setCursor] = useState<CursorOrigin | null>(null);
  const provenance = useProvenance(model.id, showOrigins ? base.id : null);
  const originMarks = useMemo(
    () =>
      showOrigins && provenance.data
        ? { text: checked.text, marks: lineOrigins(checked.text, base.document, provenance.data) }
        : null,
    [showOrigins, provenance.data, checked.text, base.document],
  );

  const onEdits = useCallback(
    (edits: DocumentEdit[]) => {
      try {
        setText(applyEdits(textRef.current, edits));
      } catch (error) {
        toast({
          tone: 'error',
          title: 'The form could not change the text',
          description: error instanceof Error ? error.message : undefined,
        });
      }
    },
    [setText, toast],
  );

  const accept = (finding: Finding, reason: string) => {
    onEdits([{ kind: 'append', path: ['accepted'], value: { rule: finding.rule, path: finding.path, reason } }]);
    setAccepting(null);
    toast({
      tone: 'info',
      title: `Accepted the ${finding.severity === 'warning' ? 'warning' : 'note'} (${finding.rule})`,
      description: 'It is in the setup’s accepted list now; save a revision to keep it.',
    });
  };

  const withdraw = (finding: Finding) => {
    const index = acceptedIndex(readDocumentData(textRef.current), finding);
    if (index >= 0) onEdits([{ kind: 'delete', path: ['accepted', index] }]);
  };

  const openFile = async (event: ChangeEvent<HTMLInputElement>) => {
    // Take the file, then clear the input so that choosing the same file again still counts.
    const file = event.target.files?.[0];
    event.target.value = '';
    if (!file) return;
    if (!/\.ya?ml$/i.test(file.name)) {
      toast({
        tone: 'error',
        title: `${file.name} was not opened`,
        description: 'Open a setup saved as a .yaml or .yml file.',
      });
      return;
    }
    if (file.size > MAX_FILE_BYTES) {
      toast({
        tone: 'error',
        title: `${file.name} was not opened`,
        description: `It is ${Math.ceil(file.size / 1024)} KB; setups up to 512 KB are accepted.`,
      });
      return;
    }
    try {
      setText(await readText(file));
    } catch (error) {
      toast({
        tone: 'error',
        title: `${file.name} could not be read`,
        description: error instanceof Error ? error.message : undefined,
      });
      return;
    }
    setTab('text');
    toast({
      tone: 'info',
      title: `Opened ${file.name} in the editor`,
      description: `Look over the findings, then save it as revision ${base.number + 1}.`,
    });
  };

  const download = () => {
    const url = URL.createObjectURL(new Blob([text], { type: 'application/yaml' }));
    const link = document.createElement('a');
    link.href = url;
    link.download = `${fileStem(model.name)}-r${base.number}${dirty ? '-edited' : ''}.yaml`;
    document.body.append(link);
    link.click();
    link.remove();
    URL.revokeObjectURL(url);
  };

  const isStale = (error: unknown) => isApiError(error) && error.status === 409 && error.code === 'stale-base';

  const submitSave = (message: string) => {
    const yaml = textRef.current;
    save.mutate(
      { base: base.number, message, yaml },
      {
        onSuccess: (saved) => {
          setBase({ id: saved.id, number: saved.number, yaml, document: analyzeSetup(yaml).data });
          setSaveOpen(false);
          setStale(null);
          setRestored(false);
          toast({ title: `Saved revision ${saved.number}`, description: countsSentence(saved) });
        },
        onError: (error) => {
          if (!isStale(error)) return;
          setSaveOpen(false);
          const latest = model.latest;
          setStale({
            info: staleBaseOf(isApiError(error) ? error.details : null) ?? {
              latest: latest?.number ?? base.number + 1,
              latestId: latest?.id ?? null,
            },
            refused: true,
          });
        },
      },
    );
  };

  const standOn = (latest: Revision, keepText: boolean) => {
    setBase(baseOf(latest));
    if (!keepText) setText(latest.yaml);
    setStale(null);
    setRestored(false);
    toast({
      tone: 'info',
      title: keepText ? `Your text now stands on revision ${latest.number}` : `Opened revision ${latest.number}`,
      description: keepText ? 'Look over the findings and save again when it is right.' : undefined,
    });
  };

  const latest = model.latest;
  const newer = latest !== null && latest.number > base.number;

  return (
    <>
      <PageHeader
        title="Edit"
        documentTitle={`Edit · ${model.name}`}
        description={`${model.name}: the setup as YAML text, with forms for the controls, link, channel plan, pin maps and mixes on the same document, checked as you type.`}
        actions={
          <>
            {canEdit && (
              <>
                <input
                  ref={fileInput}
                  type="file"
                  accept=".yaml,.yml,application/yaml,text/yaml"
                  className="sr-only"
                  tabIndex={-1}
                  aria-hidden="true"
                  onChange={(event) => void openFile(event)}
                />
                <Button variant="secondary" onClick={() => fileInput.current?.click()}>
                  Open a file…
                </Button>
              </>
            )}
            <Link to="/help/format" className={buttonClasses('quiet')}>
              Format reference
            </Link>
            <Button variant="secondary" onClick={download}>
              Download text
            </Button>
            {canEdit && (
              <Button
                disabled={!dirty || !checked.analysis.readable || checking}
                title={
                  !dirty
                    ? `Nothing to save: the text is as revision ${base.number} has it.`
                    : !checked.analysis.readable
                      ? 'The text is not readable YAML: fix the syntax finding first.'
                      : undefined
                }
                onClick={() => {
                  save.reset();
                  setSaveOpen(true);
                }}
              >
                Save revision…
              </Button>
            )}
          </>
        }
      />

      <div className="mb-4 space-y-2">
        {!canEdit && (
          <Notice icon={InfoIcon}>
            You are a <strong className="font-semibold">{role}</strong> in this workspace: you can read and download
            this setup, but not change it.
          </Notice>
        )}
        {restored && dirty && (
          <Notice
            icon={PencilIcon}
            actions={
              <Button variant="secondary" size="sm" onClick={() => setDiscardOpen(true)}>
                Discard them
              </Button>
            }
          >
            Your unsaved changes from earlier in this tab are back. The edit started from revision {base.number}.
          </Notice>
        )}
        {newer && !stale && canEdit && (
          <Notice
            tone="caution"
            icon={StaleIcon}
            actions={
              <Button
                variant="secondary"
                size="sm"
                onClick={() => setStale({ info: { latest: latest.number, latestId: latest.id }, refused: false })}
              >
                See what changed
              </Button>
            }
          >
            Revision {latest.number} has been saved since revision {base.number}, the one this edit started from. Saving
            will show what changed before anything is stored.
          </Notice>
        )}
      </div>

      {stale && (
        <StaleBasePanel
          base={base}
          stale={stale.info}
          refused={stale.refused}
          mine={checked.text === text ? checked.analysis.data : analyzeSetup(text).data}
          onReapply={(revision) => standOn(revision, true)}
          mineText={text}
          onLoadLatest={(revision) => standOn(revision, false)}
          onMerge={(revision, merged) => {
            standOn(revision, true);
            setText(merged);
          }}
          onDismiss={() => setStale(null)}
        />
      )}

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="min-w-0">
          <div className="flex flex-wrap items-end justify-between gap-x-4 gap-y-2">
            <EditorTabs value={tab} onChange={setTab} />
            <p className="flex items-center gap-2 pb-2 text-sm text-ink-700">
              <span>
                {canEdit ? 'Editing from' : 'Showing'} revision {base.number}
              </span>
              {dirty ? (
                <>
                  <Badge tone="accent" icon={PencilIcon}>
                    Unsaved changes
                  </Badge>
                  <Button variant="quiet" size="sm" onClick={() => setDiscardOpen(true)}>
                    Discard
                  </Button>
                </>
              ) : (
                canEdit && <Badge icon={CheckIcon}>No unsaved changes</Badge>
              )}
            </p>
          </div>

          <div id="editor-panel-text" role="tabpanel" aria-labelledby="editor-tab-text" hidden={tab !== 'text'}>
            <label className="mb-2 flex min-h-11 w-fit items-center gap-2 text-sm text-ink-900 sm:min-h-0">
              <input
                type="checkbox"
                checked={showOrigins}
                onChange={(event) => setShowOrigins(event.target.checked)}
                className="size-4 accent-accent-700"
              />
              Show where each line came from
              {showOrigins && provenance.isPending && <Spinner className="text-accent-700" />}
              {showOrigins && provenance.isError && (
                <span className="text-danger-700">(could not be read: {provenance.error.message})</span>
              )}
              {showOrigins && provenance.data && dirty && (
                <span className="text-ink-700">(lines you changed show nothing until saved)</span>
              )}
            </label>
            <div className="flex h-[max(22rem,60vh)] flex-col overflow-hidden rounded-lg border border-ply-300 bg-paper-raised lg:h-[max(30rem,calc(100vh-9rem))]">
              <div className="min-h-0 flex-1">
                <Suspense fallback={<LoadingState label="Loading the text editor…" />}>
                  <YamlCodeEditor
                    value={text}
                    onChange={setText}
                    readOnly={!canEdit}
                    checked={marks}
                    jump={jump}
                    visible={tab === 'text'}
                    label={`Setup text of ${model.name}`}
                    comments={commentMarks}
                    origins={originMarks}
                    onCursorOrigin={setCursor}
                  />
                </Suspense>
              </div>
              {/* The gutter's marks tell their detail on hover; this bar says the cursor line's, so the
                  keyboard reaches it too. It stays in the page while hidden, so its first words are announced. */}
              <p
                role="status"
                aria-live="polite"
                className={originMarks ? 'border-t border-ply-300 px-3 py-2 text-sm text-ink-700' : 'sr-only'}
              >
                {originMarks && cursor ? cursorOriginText(cursor.line, cursor.origin) : ''}
              </p>
            </div>
          </div>
          {tab !== 'text' && (
            <div id={`editor-panel-${tab}`} role="tabpanel" aria-labelledby={`editor-tab-${tab}`} className="pt-1">
              {formData === null ? (
                <Notice
                  tone="caution"
                  icon={WarningIcon}
                  actions={
                    <Button variant="secondary" size="sm" onClick={() => setTab('text')}>
                      Show the text
                    </Button>
                  }
                >
                  The text is not readable YAML right now, so the forms cannot show it. Fix the syntax finding in the
                  text first.
                </Notice>
              ) : tab === 'controls' ? (
                <ControlsLinkForm data={formData} readOnly={!canEdit} onEdits={onEdits} />
              ) : tab === 'plan' ? (
                <ChannelPlanForm data={formData} readOnly={!canEdit} onEdits={onEdits} />
              ) : tab === 'pins' ? (
                <PinMapForms data={formData} readOnly={!canEdit} onEdits={onEdits} />
              ) : (
                <MixesForm data={formData} readOnly={!canEdit} onEdits={onEdits} />
              )}
            </div>
          )}
        </div>

        <aside aria-labelledby={checksId} className="min-w-0 lg:sticky lg:top-4 lg:self-start">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <h2 id={checksId} className="text-lg font-semibold text-ink-900">
              Checks
            </h2>
            <p className="flex min-h-6 items-center gap-1.5 text-sm text-ink-700" aria-live="polite">
              {checking ? (
                <>
                  <Spinner className="text-accent-700" />
                  Checking…
                </>
              ) : (
                <span className="sr-only">{countWords(counts)}</span>
              )}
            </p>
          </div>
          <p className="mt-1 flex flex-wrap gap-1.5" aria-hidden="true">
            <SeverityBadge severity="error" count={counts.errors} />
            <SeverityBadge severity="warning" count={counts.warnings} />
            <SeverityBadge severity="info" count={counts.infos} />
            {counts.accepted > 0 && <Badge icon={CheckIcon}>{counts.accepted} accepted</Badge>}
          </p>
          <div className="mt-3 max-h-[calc(100vh-9rem)] overflow-y-auto">
            <FindingsList
              findings={checked.analysis.findings}
              modelId={model.id}
              emptyText="The setup passes every check."
              onAccept={canEdit ? setAccepting : undefined}
              onWithdraw={canEdit ? withdraw : undefined}
            />
            {(threads.data?.length ?? 0) > 0 && (
              <OpenComments modelId={model.id} threads={threads.data ?? []} placed={placed} />
            )}
          </div>
        </aside>
      </div>

      {saveOpen && (
        <SaveDialog
          base={base.number}
          counts={counts}
          pending={save.isPending}
          error={save.isError && !isStale(save.error) ? save.error.message : null}
          onSave={submitSave}
          onClose={() => setSaveOpen(false)}
          signOff={signOffOf(model, base, checked.analysis.data)}
        />
      )}
      {accepting && (
        <AcceptFindingDialog
          finding={accepting}
          onAccept={(reason) => accept(accepting, reason)}
          onClose={() => setAccepting(null)}
        />
      )}
      {discardOpen && (
        <Dialog title="Discard your unsaved changes?" onClose={() => setDiscardOpen(false)}>
          <p className="text-base text-ink-700">The text goes back to revision {base.number} as it was saved.</p>
          <div className="mt-4 flex flex-wrap justify-end gap-2">
            <Button variant="secondary" onClick={() => setDiscardOpen(false)} data-autofocus>
              Keep them
            </Button>
            <Button
              variant="danger"
              onClick={() => {
                setText(base.yaml);
                setRestored(false);
                setDiscardOpen(false);
              }}
            >
              Discard changes
            </Button>
          </div>
        </Dialog>
      )}
      <LeaveGuard dirty={dirty && !save.isPending} />
    </>
  );
}

/** The open threads of the revision being edited, each with the line its setting is on now. */
function OpenComments({
  modelId,
  threads,
  placed,
}: {
  modelId: string;
  threads: readonly CommentThread[];
  placed: readonly CommentLine[];
}) {
  const lineOf = new Map(placed.flatMap(({ line, threads: onLine }) => onLine.map((thread) => [thread.id, line])));
  return (
    <section aria-labelledby="open-comments-heading" className="mt-5 border-t border-ply-200 pt-4">
      <h3 id="open-comments-heading" className="text-base font-semibold text-ink-900">
        Open comments ({threads.length})
      </h3>
      <p className="text-sm text-ink-700">Marked beside their line in the text.</p>
      <ul className="mt-2 space-y-2">
        {threads.map((thread) => {
          const line = lineOf.get(thread.id);
          return (
            <li key={thread.id} className="rounded-md border border-ply-200 bg-paper px-3 py-2 text-sm">
              <p className="font-medium text-ink-900">
                {settingWords(thread.path)}
                {line !== undefined && (
                  <>
                    {' · '}
                    <Link to={`/models/${encodeURIComponent(modelId)}/edit?line=${line}`}>line {line}</Link>
                  </>
                )}
              </p>
              <p className="text-ink-900">
                <span className="text-ink-700">{thread.author?.name ?? 'Former member'}:</span> {thread.body}
              </p>
              {thread.replies.length > 0 && (
                <p className="text-ink-700">
                  {thread.replies.length} {thread.replies.length === 1 ? 'reply' : 'replies'}
                </p>
              )}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
