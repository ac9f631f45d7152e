import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, apiRequest } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { CreatedModel } from '../types';
import { hangarQueryKey } from './list-models';
import { paths } from '../../../lib/api-paths';

export interface CreateModelInput {
  workspaceId: Id;
  name: string;
  /** The first revision's YAML; the server starts from its starter setup when absent. */
  yaml?: string;
  message?: string;
}

export async function createModel({ workspaceId, ...body }: CreateModelInput): Promise<CreatedModel> {
  return (await api.post<CreatedModel>(paths.workspaceModels(workspaceId), body)).data;
}

export interface UploadModelInput {
  workspaceId: Id;
  file: File;
  /** Left out, the server names the model after the setup's own name or the file. */
  name?: string;
  message?: string;
}

export async function uploadModel({ workspaceId, file, name, message }: UploadModelInput): Promise<CreatedModel> {
  const form = new FormData();
  form.set('file', file);
  if (name) form.set('name', name);
  if (message) form.set('message', message);
  const path = paths.workspaceModelUpload(workspaceId);
  return (await apiRequest<CreatedModel>(path, { method: 'POST', body: form })).data;
}

export interface ForkModelInput {
  /** The model whose revision is copied. */
  modelId: Id;
  number: number;
  /** The workspace the new model goes into. */
  workspaceId: Id;
  name?: string;
  message?: string;
}

export async function forkModel({
  modelId,
  number,
  workspaceId,
  name,
  message,
}: ForkModelInput): Promise<CreatedModel> {
  const body = { number, workspace: workspaceId, ...(name ? { name } : {}), ...(message ? { message } : {}) };
  return (await api.post<CreatedModel>(paths.modelFork(modelId), body)).data;
}

/** After a new model exists, the hangar it went into is out of date. */
function useRefreshHangar() {
  const queryClient = useQueryClient();
  return (created: CreatedModel) =>
    queryClient.invalidateQueries({ queryKey: hangarQueryKey(created.model.workspace_id) });
}

export function useCreateModel() {
  const refresh = useRefreshHangar();
  return useMutation({ mutationFn: createModel, onSuccess: refresh });
}

export function useUploadModel() {
  const refresh = useRefreshHangar();
  return useMutation({ mutationFn: uploadModel, onSuccess: refresh });
}

export function useForkModel() {
  const refresh = useRefreshHangar();
  return useMutation({ mutationFn: forkModel, onSuccess: refresh });
}
