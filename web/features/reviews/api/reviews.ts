import {
  infiniteQueryOptions,
  queryOptions,
  useInfiniteQuery,
  useMutation,
  useQuery,
  useQueryClient,
} from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type {
  BaseParam,
  ChecklistEntry,
  CommentStatus,
  CommentThread,
  ReviewDetail,
  ReviewSummary,
  Verdict,
  VerdictEntry,
} from '../types';
import { paths } from '../../../lib/api-paths';
import { getPage, offsetPaging, type Page } from '../../../lib/paged';

export const reviewQueryKey = (reviewId: Id, base: BaseParam = null) =>
  ['reviews', reviewId, base ?? 'default'] as const;
/** Every base of one review: ticks, verdicts and threads change them all. */
const anyBaseKey = (reviewId: Id) => ['reviews', reviewId] as const;
export const workspaceReviewsQueryKey = (workspaceId: Id) => ['workspaces', workspaceId, 'reviews'] as const;
export const modelReviewsQueryKey = (modelId: Id) => ['models', modelId, 'reviews'] as const;

export const REVIEWS_PAGE_SIZE = 50;

export type ReviewStatus = 'open' | 'closed' | 'all';

export function listWorkspaceReviews(
  workspaceId: Id,
  status: ReviewStatus,
  offset: number,
  signal?: AbortSignal,
): Promise<Page<ReviewSummary>> {
  const path = paths.workspaceReviews(workspaceId, { status, limit: REVIEWS_PAGE_SIZE, offset });
  return getPage<ReviewSummary>(path, offset, signal);
}

export function listModelReviews(modelId: Id, offset: number, signal?: AbortSignal): Promise<Page<ReviewSummary>> {
  return getPage<ReviewSummary>(paths.modelReviews(modelId, { limit: REVIEWS_PAGE_SIZE, offset }), offset, signal);
}

export async function getReview(reviewId: Id, base: BaseParam, signal?: AbortSignal): Promise<ReviewDetail> {
  return (await api.get<ReviewDetail>(paths.review(reviewId, { base }), signal)).data;
}

/** The workspace's open or decided reviews, newest first, a page at a time. */
export function workspaceReviewsQueryOptions(workspaceId: Id, status: ReviewStatus) {
  return infiniteQueryOptions({
    queryKey: [...workspaceReviewsQueryKey(workspaceId), status],
    queryFn: ({ pageParam, signal }) => listWorkspaceReviews(workspaceId, status, pageParam, signal),
    ...offsetPaging,
  });
}

/** The model's reviews, newest first, a page at a time. */
export function modelReviewsQueryOptions(modelId: Id) {
  return infiniteQueryOptions({
    queryKey: modelReviewsQueryKey(modelId),
    queryFn: ({ pageParam, signal }) => listModelReviews(modelId, pageParam, signal),
    ...offsetPaging,
  });
}

export function reviewQueryOptions(reviewId: Id, base: BaseParam = null) {
  return queryOptions({
    queryKey: reviewQueryKey(reviewId, base),
    queryFn: ({ signal }) => getReview(reviewId, base, signal),
  });
}

export const useWorkspaceReviews = (workspaceId: Id, status: ReviewStatus) =>
  useInfiniteQuery({ ...workspaceReviewsQueryOptions(workspaceId, status), enabled: workspaceId !== '' });
export const useModelReviews = (modelId: Id) => useInfiniteQuery(modelReviewsQueryOptions(modelId));
/** The review compared with `base`; the page keeps showing the last answer while another base loads. */
export const useReview = (reviewId: Id, base: BaseParam = null) =>
  useQuery({ ...reviewQueryOptions(reviewId, base), placeholderData: (previous) => previous });

/** After any change to a review: the review, the lists, and the model's review state (hangar, model page). */
function useRefreshAfterReview() {
  const queryClient = useQueryClient();
  return (review: { id: Id; workspace_id?: Id; model?: { id: Id } }) => {
    void queryClient.invalidateQueries({ queryKey: anyBaseKey(review.id) });
    void queryClient.invalidateQueries({ queryKey: ['reviews'] });
    if (review.workspace_id) {
      void queryClient.invalidateQueries({ queryKey: workspaceReviewsQueryKey(review.workspace_id) });
      void queryClient.invalidateQueries({ queryKey: ['workspaces', review.workspace_id, 'models'] });
      void queryClient.invalidateQueries({ queryKey: ['workspaces', review.workspace_id, 'audit'] });
    }
    if (review.model) {
      void queryClient.invalidateQueries({ queryKey: ['models', review.model.id] });
    }
  };
}

export interface RequestReviewInput {
  revisionId: Id;
  reviewers: Id[];
  note?: string;
}

export async function requestReview({ revisionId, ...body }: RequestReviewInput): Promise<ReviewSummary> {
  return (await api.post<ReviewSummary>(paths.revisionReviews(revisionId), body)).data;
}

export function useRequestReview() {
  const refresh = useRefreshAfterReview();
  return useMutation({ mutationFn: requestReview, onSuccess: refresh });
}

export interface VerdictInput {
  verdict: Verdict;
  body?: string;
  /** The approver has seen what is left undone and approves all the same. */
  confirm_left_open?: boolean;
}

export async function giveVerdict(
  reviewId: Id,
  input: VerdictInput,
): Promise<VerdictEntry & { review: { id: Id; state: string } }> {
  return (await api.post<VerdictEntry & { review: { id: Id; state: string } }>(paths.reviewVerdicts(reviewId), input))
    .data;
}

export function useGiveVerdict(review: Pick<ReviewDetail, 'id' | 'workspace_id' | 'model'>) {
  const refresh = useRefreshAfterReview();
  return useMutation({
    mutationFn: (input: VerdictInput) => giveVerdict(review.id, input),
    onSuccess: () => refresh(review),
  });
}

export async function tickItem(reviewId: Id, item: string, ticked: boolean): Promise<ChecklistEntry[]> {
  return (await api.post<ChecklistEntry[]>(paths.reviewChecklist(reviewId), { item, ticked })).data;
}

/** Ticks at once on screen (a checkbox must answer the click), set right by the server's answer or undone on failure. */
export function useTickItem(review: Pick<ReviewDetail, 'id'>, base: BaseParam) {
  const queryClient = useQueryClient();
  const key = reviewQueryKey(review.id, base);
  return useMutation({
    mutationFn: ({ item, ticked }: { item: string; ticked: boolean }) => tickItem(review.id, item, ticked),
    onMutate: async ({ item, ticked }) => {
      await queryClient.cancelQueries({ queryKey: key });
      const before = queryClient.getQueryData<ReviewDetail>(key);
      queryClient.setQueryData<ReviewDetail>(key, (current) =>
        current
          ? {
              ...current,
              checklist: current.checklist.map((entry) =>
                entry.id === item ? { ...entry, ticked, carried: ticked ? entry.carried : null } : entry,
              ),
            }
          : current,
      );
      return { before };
    },
    onError: (_error, _input, context) => {
      if (context?.before) queryClient.setQueryData(key, context.before);
    },
    onSuccess: (checklist) => {
      queryClient.setQueryData<ReviewDetail>(key, (current) => (current ? { ...current, checklist } : current));
      void queryClient.invalidateQueries({ queryKey: anyBaseKey(review.id), refetchType: 'none' });
    },
  });
}

export interface ThreadInput {
  path?: string;
  body: string;
}

export async function startReviewThread(reviewId: Id, input: ThreadInput): Promise<CommentThread> {
  return (await api.post<CommentThread>(paths.reviewComments(reviewId), input)).data;
}

export async function startRevisionThread(revisionId: Id, input: ThreadInput): Promise<CommentThread> {
  return (await api.post<CommentThread>(paths.revisionComments(revisionId), input)).data;
}

export type ThreadStep = { kind: 'reply'; body: string } | { kind: 'resolve' } | { kind: 'reopen' };

export async function stepThread(threadId: Id, step: ThreadStep): Promise<CommentThread> {
  if (step.kind === 'reply')
    return (await api.post<CommentThread>(paths.commentReplies(threadId), { body: step.body })).data;
  return (await api.post<CommentThread>(paths.commentStep(threadId, step.kind), {})).data;
}

export const revisionThreadsQueryKey = (revisionId: Id) => ['revisions', revisionId, 'comments'] as const;

/** The threads shown on a revision (its own and those carried), for the editor and the Overview. */
export async function listThreads(
  revisionId: Id,
  status: CommentStatus,
  signal?: AbortSignal,
): Promise<CommentThread[]> {
  return (await api.get<CommentThread[]>(paths.revisionComments(revisionId, { status, limit: 200 }), signal)).data;
}

export function useRevisionThreads(revisionId: Id | null | undefined, status: CommentStatus) {
  return useQuery({
    queryKey: [...revisionThreadsQueryKey(revisionId ?? ''), status],
    queryFn: ({ signal }) => listThreads(revisionId!, status, signal),
    enabled: Boolean(revisionId),
  });
}

export const THREADS_PAGE_SIZE = 20;

/** The threads shown on a revision with one status, a page at a time, oldest first (the review page, the Overview). */
export function usePagedThreads(revisionId: Id, status: Exclude<CommentStatus, 'all'>) {
  return useInfiniteQuery({
    queryKey: [...revisionThreadsQueryKey(revisionId), status, 'paged'],
    queryFn: ({ pageParam, signal }) =>
      getPage<CommentThread>(
        paths.revisionComments(revisionId, { status, limit: THREADS_PAGE_SIZE, offset: pageParam }),
        pageParam,
        signal,
      ),
    ...offsetPaging,
  });
}

/** Threads change the review (every base), the revision's open threads, and the audit trail. */
function useRefreshThreads() {
  const queryClient = useQueryClient();
  return (where: { reviewId?: Id | null; workspaceId?: Id }) => {
    if (where.reviewId) void queryClient.invalidateQueries({ queryKey: anyBaseKey(where.reviewId) });
    void queryClient.invalidateQueries({
      queryKey: ['revisions'],
      predicate: (query) => query.queryKey[2] === 'comments',
    });
    if (where.workspaceId) void queryClient.invalidateQueries({ queryKey: ['workspaces', where.workspaceId, 'audit'] });
  };
}

/** Starts a thread in the review, or on the revision when there is no review (the Overview). */
export function useStartThread(where: { reviewId?: Id; revisionId: Id; workspaceId: Id }) {
  const refresh = useRefreshThreads();
  return useMutation({
    mutationFn: (input: ThreadInput) =>
      where.reviewId ? startReviewThread(where.reviewId, input) : startRevisionThread(where.revisionId, input),
    onSuccess: () => refresh(where),
  });
}

export function useStepThread(where: { reviewId?: Id | null; workspaceId: Id }) {
  const refresh = useRefreshThreads();
  return useMutation({
    mutationFn: ({ threadId, step }: { threadId: Id; step: ThreadStep }) => stepThread(threadId, step),
    onSuccess: () => refresh(where),
  });
}
