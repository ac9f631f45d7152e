import type { Id } from '../../types/api';
import type { AuditEvent } from './types';

export interface AuditLine {
  /** The model a save, tag or review was about, to stand before the line: "Kestrel Mk II". */
  model: string | null;
  /** What the actor did, to follow their name: "invited juno@example.org as a reviewer". */
  text: string;
  /** Where the record it is about can be seen, when there is such a place. */
  link: { to: string; label: string } | null;
}

const str = (value: unknown): string =>
  typeof value === 'string' ? value : typeof value === 'number' ? String(value) : '';
const quoted = (value: unknown): string => `“${str(value)}”`;
const article = (role: unknown): string => `${role === 'owner' || role === 'editor' ? 'an' : 'a'} ${str(role)}`;

function names(value: unknown): string {
  if (!Array.isArray(value)) return 'a reviewer';
  const list = value
    .map((entry) => (entry && typeof entry === 'object' ? str((entry as { name?: unknown }).name) : str(entry)))
    .filter(Boolean);
  if (list.length <= 1) return list[0] ?? 'a reviewer';
  return `${list.slice(0, -1).join(', ')} and ${list[list.length - 1]}`;
}

const VERDICTS: Record<string, string> = {
  approve: 'approved',
  'request-changes': 'asked for changes to',
  comment: 'commented on',
};

// Events about a model's revisions, tags and reviews say which model; a model's own
// events name it in their words already.
const NAMES_ITS_MODEL = /^(revision|tag|review|comment)\./;

/** One audit event in plain words, with the model it was about and a link to what it concerns. */
export function auditLine(event: AuditEvent, workspaceId: Id): AuditLine {
  const words = describe(event, workspaceId);
  const model = NAMES_ITS_MODEL.test(event.action)
    ? (event.model?.name ?? (str(event.details.model_name) || null))
    : null;
  return { model, ...words };
}

function describe(event: AuditEvent, workspaceId: Id): Omit<AuditLine, 'model'> {
  const d = event.details;
  const modelId = event.model?.id ?? d.model_id;
  const model = (id: unknown, screen: string) =>
    typeof id === 'string' && id ? { to: `/models/${id}/${screen}`, label: 'Open the model' } : null;
  const review = event.subject.id
    ? { to: `/w/${workspaceId}/reviews/${event.subject.id}`, label: 'Open the review' }
    : null;
  const receiver = event.subject.id
    ? { to: `/w/${workspaceId}/shelf/${event.subject.id}`, label: 'Open the receiver' }
    : null;

  switch (event.action) {
    case 'model.created':
      return { text: `created the model ${quoted(d.name)}`, link: model(event.subject.id, 'overview') };
    case 'model.renamed':
      return {
        text: `renamed the model ${quoted(d.from)} to ${quoted(d.to)}`,
        link: model(event.subject.id, 'overview'),
      };
    case 'model.forked':
      return {
        text: `forked revision ${str(d.source_number)} of another model into ${quoted(d.name)}`,
        link: model(event.subject.id, 'overview'),
      };
    case 'revision.saved':
    case 'revision.uploaded': {
      const errors =
        typeof d.errors === 'number' && d.errors > 0 ? ` (${d.errors} ${d.errors === 1 ? 'error' : 'errors'})` : '';
      const how = event.action === 'revision.uploaded' ? 'uploaded' : 'saved';
      return { text: `${how} revision ${str(d.number)}${errors}`, link: model(modelId, 'history') };
    }
    case 'revision.reverted':
      return {
        text: `brought back revision ${str(d.reverted_to)} as revision ${str(d.number)}`,
        link: model(modelId, 'history'),
      };
    case 'tag.added':
      return { text: `tagged revision ${str(d.number)} ${quoted(d.name)}`, link: model(modelId, 'history') };
    case 'tag.removed':
      return { text: `removed the tag ${quoted(d.name)}`, link: model(modelId, 'history') };
    case 'member.invited':
      return { text: `invited ${str(d.email)} as ${article(d.role)}`, link: null };
    case 'invitation.revoked':
      return { text: `withdrew the invitation to ${str(d.email)}`, link: null };
    case 'member.joined':
      return { text: `joined as ${article(d.role)}`, link: null };
    case 'member.role-changed':
      return { text: `changed the role of ${str(d.name)} from ${str(d.from)} to ${str(d.to)}`, link: null };
    case 'member.removed':
      return { text: `removed ${str(d.name)} (${str(d.role)}) from the workspace`, link: null };
    case 'member.left':
      return { text: 'left the workspace', link: null };
    case 'review.requested':
      return { text: `asked ${names(d.reviewers)} to review revision ${str(d.number)}`, link: review };
    case 'review.verdict':
      return { text: `${VERDICTS[str(d.verdict)] ?? 'gave a verdict on'} revision ${str(d.number)}`, link: review };
    case 'review.commented':
      return event.subject.type === 'revision'
        ? {
            text: `commented${d.path ? ` on ${str(d.path)}` : ''} on revision ${str(d.number)}`,
            link: model(modelId, 'overview'),
          }
        : {
            text: `commented${d.path ? ` on ${str(d.path)}` : ''} in the review of revision ${str(d.number)}`,
            link: review,
          };
    case 'comment.replied':
      return { text: `replied to a comment${d.path ? ` on ${str(d.path)}` : ''}`, link: model(modelId, 'overview') };
    case 'comment.resolved':
      return { text: `resolved a comment${d.path ? ` on ${str(d.path)}` : ''}`, link: model(modelId, 'overview') };
    case 'comment.reopened':
      return { text: `reopened a comment${d.path ? ` on ${str(d.path)}` : ''}`, link: model(modelId, 'overview') };
    case 'receiver.added':
      return { text: `put the receiver ${quoted(d.label)} on the shelf`, link: receiver };
    case 'receiver.updated':
      return { text: 'updated a receiver’s details on the shelf', link: receiver };
    case 'receiver.installed':
      return { text: `installed a receiver in ${quoted(d.model_name)} as its receiver ${str(d.slot)}`, link: receiver };
    case 'receiver.removed':
      return { text: `took a receiver out of ${quoted(d.model_name)}`, link: receiver };
    case 'receiver.settings-applied':
      return { text: `recorded the settings changed on a receiver for ${quoted(d.model_name)}`, link: receiver };
    case 'revision.merged':
      return {
        text: `took in revision ${str(d.source_number)} of the source as revision ${str(d.number)}`,
        link: model(modelId, 'history'),
      };
    case 'rules.changed':
      return { text: 'changed the club rules', link: null };
    default:
      return { text: event.action.replace(/[._-]/g, ' '), link: null };
  }
}
