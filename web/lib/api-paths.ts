// Every path the client asks the API for, in one place: what a route is called (the
// server's list is api/routes/route-table.ts) is decided here and nowhere else in web/,
// and every id or name that goes into a path is encoded here. A test
// (tests/web/api-paths.test.ts) fails when another file of web/ writes an /api/ path.

type QueryValue = string | number | boolean | null | undefined;
/** Query parameters; those left undefined or null are not sent. */
export type Query = Record<string, QueryValue>;

/** Where every API path starts (the service worker tells API answers apart by it). */
export const API = '/api';
const seg = encodeURIComponent;

function withQuery(path: string, query?: Query): string {
  if (!query) return path;
  const params = new URLSearchParams();
  for (const [name, value] of Object.entries(query))
    if (value !== undefined && value !== null) params.set(name, String(value));
  const text = params.toString();
  return text ? `${path}?${text}` : path;
}

const workspace = (workspaceId: string) => `${API}/workspaces/${seg(workspaceId)}`;
const model = (modelId: string) => `${API}/models/${seg(modelId)}`;
const revision = (revisionId: string) => `${API}/revisions/${seg(revisionId)}`;
const review = (reviewId: string) => `${API}/reviews/${seg(reviewId)}`;
const receiver = (receiverId: string) => `${API}/receivers/${seg(receiverId)}`;
const comment = (commentId: string) => `${API}/comments/${seg(commentId)}`;

export const paths = {
  session: () => `${API}/session`,
  me: (query?: Query) => withQuery(`${API}/me`, query),
  signUp: () => `${API}/auth/sign-up`,
  signIn: () => `${API}/auth/sign-in`,
  signOut: () => `${API}/auth/sign-out`,
  signOutEverywhere: () => `${API}/auth/sign-out-everywhere`,
  password: () => `${API}/auth/password`,
  passwordReset: () => `${API}/auth/password-reset`,
  passwordResetLink: (token: string) => `${API}/auth/password-reset/${seg(token)}`,
  outbox: (query?: Query) => withQuery(`${API}/outbox`, query),

  invitation: (token: string) => `${API}/invitations/${seg(token)}`,
  acceptInvitation: (token: string) => `${API}/invitations/${seg(token)}/accept`,

  workspaceMembers: (workspaceId: string, query?: Query) => withQuery(`${workspace(workspaceId)}/members`, query),
  workspaceMember: (workspaceId: string, userId: string) => `${workspace(workspaceId)}/members/${seg(userId)}`,
  workspaceInvitations: (workspaceId: string, query?: Query) =>
    withQuery(`${workspace(workspaceId)}/invitations`, query),
  workspaceInvitation: (workspaceId: string, invitationId: string) =>
    `${workspace(workspaceId)}/invitations/${seg(invitationId)}`,
  workspaceAudit: (workspaceId: string, query?: Query) => withQuery(`${workspace(workspaceId)}/audit`, query),
  workspaceModels: (workspaceId: string, query?: Query) => withQuery(`${workspace(workspaceId)}/models`, query),
  workspaceModelUpload: (workspaceId: string) => `${workspace(workspaceId)}/models/upload`,
  workspaceReviews: (workspaceId: string, query?: Query) => withQuery(`${workspace(workspaceId)}/reviews`, query),
  workspaceReceivers: (workspaceId: string, query?: Query) => withQuery(`${workspace(workspaceId)}/receivers`, query),
  workspaceExport: (workspaceId: string) => `${workspace(workspaceId)}/export.git`,
  workspaceImport: (workspaceId: string) => `${workspace(workspaceId)}/import`,
  workspaceImports: (workspaceId: string) => `${workspace(workspaceId)}/imports`,
  workspaceImportJob: (workspaceId: string, jobId: string) => `${workspace(workspaceId)}/imports/${seg(jobId)}`,
  workspaceRules: (workspaceId: string) => `${workspace(workspaceId)}/rules`,

  model: (modelId: string) => model(modelId),
  modelArchive: (modelId: string, archived: boolean) => `${model(modelId)}/${archived ? 'archive' : 'unarchive'}`,
  modelRevisions: (modelId: string, query?: Query) => withQuery(`${model(modelId)}/revisions`, query),
  /** A revision named by its number in the model. */
  modelRevisionNumber: (modelId: string, number: number | string) =>
    `${model(modelId)}/revisions/${seg(String(number))}`,
  modelRevert: (modelId: string) => `${model(modelId)}/revert`,
  modelFork: (modelId: string) => `${model(modelId)}/fork`,
  modelReviews: (modelId: string, query?: Query) => withQuery(`${model(modelId)}/reviews`, query),
  modelExport: (modelId: string) => `${model(modelId)}/export.git`,
  modelProvenance: (modelId: string, query?: Query) => withQuery(`${model(modelId)}/provenance`, query),
  modelProvenanceHistory: (modelId: string, query?: Query) => withQuery(`${model(modelId)}/provenance/history`, query),
  modelSourceUpdates: (modelId: string) => `${model(modelId)}/source-updates`,

  revision: (revisionId: string, query?: Query) => withQuery(revision(revisionId), query),
  revisionTags: (revisionId: string) => `${revision(revisionId)}/tags`,
  revisionTag: (revisionId: string, name: string) => `${revision(revisionId)}/tags/${seg(name)}`,
  revisionReviews: (revisionId: string) => `${revision(revisionId)}/reviews`,
  /** The comment threads shown on a revision (its own and those carried forward). */
  revisionComments: (revisionId: string, query?: Query) => withQuery(`${revision(revisionId)}/comments`, query),
  revisionPatch: (revisionId: string, query?: Query) => withQuery(`${revision(revisionId)}/patch`, query),
  revisionFieldSheet: (revisionId: string) => `${revision(revisionId)}/field-sheet`,
  revisionFieldSheetPdf: (revisionId: string) => `${revision(revisionId)}/field-sheet.pdf`,
  compare: (query: Query) => withQuery(`${API}/compare`, query),
  compareText: (query: Query) => withQuery(`${API}/compare/text`, query),

  review: (reviewId: string, query?: Query) => withQuery(review(reviewId), query),
  reviewVerdicts: (reviewId: string) => `${review(reviewId)}/verdicts`,
  reviewChecklist: (reviewId: string) => `${review(reviewId)}/checklist`,
  reviewComments: (reviewId: string, query?: Query) => withQuery(`${review(reviewId)}/comments`, query),

  commentReplies: (threadId: string) => `${comment(threadId)}/replies`,
  /** Resolves or reopens the thread a first comment starts. */
  commentStep: (threadId: string, step: 'resolve' | 'reopen') => `${comment(threadId)}/${step}`,

  receiver: (receiverId: string) => receiver(receiverId),
  receiverHistory: (receiverId: string, query?: Query) => withQuery(`${receiver(receiverId)}/history`, query),
  receiverReuseCheck: (receiverId: string, query: Query) => withQuery(`${receiver(receiverId)}/reuse-check`, query),
  receiverInstall: (receiverId: string) => `${receiver(receiverId)}/install`,
  receiverRemove: (receiverId: string) => `${receiver(receiverId)}/remove`,
  receiverApply: (receiverId: string) => `${receiver(receiverId)}/apply`,
};
