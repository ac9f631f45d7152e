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
import type { ChecklistEntry, CommentEntry, ReviewDetail, ReviewSummary, Verdict, VerdictEntry } from '../types';
import { paths } from '../../../lib/api-paths';
import { getPage, offsetPaging, type Page } from '../../../lib/paged';

export const reviewQueryKey = (reviewId: Id) => ['reviews', reviewId] as const;
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

export async function getReview(reviewId: Id, signal?: AbortSignal): Promise<ReviewDetail> {
  return (await api.get<ReviewDetail>(paths.review(reviewId), signal)).data;
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

export function reviewQueryOptions(reviewId: Id) {
  return queryOptions({ queryKey: reviewQueryKey(reviewId), queryFn: ({ signal }) => getReview(reviewId, signal) });
}

export const useWorkspaceReviews = (workspaceId: Id, status: ReviewStatus) =>
  useInfiniteQuery({ ...workspaceReviewsQueryOptions(workspaceId, status), enabled: workspaceId !== '' });
export const useModelReviews = (modelId: Id) => useInfiniteQuery(modelReviewsQueryOptions(modelId));
export const useReview = (reviewId: Id) => useQuery(reviewQueryOptions(reviewId));

/** After any change to a review: the review, the lists, and the model's review state (hangar, model page). */
function useRefreshAfterReview() {
  const queryClient = useQueryClient();
  return (review: { id: Id; workspace_id?: Id; model?: { id: Id } }) => {
    void queryClient.invalidateQueries({ queryKey: reviewQueryKey(review.id) });
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
export function useTickItem(review: Pick<ReviewDetail, 'id'>) {
  const queryClient = useQueryClient();
  const key = reviewQueryKey(review.id);
  return useMutation({
    mutationFn: ({ item, ticked }: { item: string; ticked: boolean }) => tickItem(review.id, item, ticked),
    onMutate: async ({ item, ticked }) => {
      await queryClient.cancelQueries({ queryKey: key });
      const before = queryClient.getQueryData<ReviewDetail>(key);
      queryClient.setQueryData<ReviewDetail>(key, (current) =>
        current
          ? {
              ...current,
              checklist: current.checklist.map((entry) => (entry.id === item ? { ...entry, ticked } : entry)),
            }
          : current,
      );
      return { before };
    },
    onError: (_error, _input, context) => {
      if (context?.before) queryClient.setQueryData(key, context.before);
    },
    onSuccess: (checklist) =>
      queryClient.setQueryData<ReviewDetail>(key, (current) => (current ? { ...current, checklist } : current)),
  });
}

export async function addComment(reviewId: Id, input: { path?: string; body: string }): Promise<CommentEntry> {
  return (await api.post<CommentEntry>(paths.reviewComments(reviewId), input)).data;
}

export function useAddComment(review: Pick<ReviewDetail, 'id' | 'workspace_id'>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { path?: string; body: string }) => addComment(review.id, input),
    onSuccess: (comment) => {
      queryClient.setQueryData<ReviewDetail>(reviewQueryKey(review.id), (current) =>
        current ? { ...current, comments: [...current.comments, comment] } : current,
      );
      void queryClient.invalidateQueries({ queryKey: ['workspaces', review.workspace_id, 'audit'] });
    },
  });
}
