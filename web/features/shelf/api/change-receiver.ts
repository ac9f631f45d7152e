import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateReceiverInput, UpdateReceiverInput } from '@shared/reuse/receiver-fields';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { Applied, Installed, ShelfUnit, UnitInstall } from '../types';
import { receiverQueryKey } from './get-receiver';

// Every change to a unit refreshes the unit, its history, its checks and the shelf
// lists it appears in; the field sheets show which unit sits in which slot, so they too.
function useRefresh() {
  const queryClient = useQueryClient();
  return (unit: { id: Id; workspace_id: Id }) => {
    void queryClient.invalidateQueries({ queryKey: receiverQueryKey(unit.id) });
    void queryClient.invalidateQueries({ queryKey: ['workspaces', unit.workspace_id, 'receivers'] });
    void queryClient.invalidateQueries({ queryKey: ['field-sheets'] });
  };
}

export function useAddReceiver(workspaceId: Id) {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: async (input: CreateReceiverInput) =>
      (await api.post<ShelfUnit>(`/api/workspaces/${encodeURIComponent(workspaceId)}/receivers`, input)).data,
    onSuccess: refresh,
  });
}

export function useUpdateReceiver(receiverId: Id) {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: async (input: UpdateReceiverInput) =>
      (await api.patch<ShelfUnit>(`/api/receivers/${encodeURIComponent(receiverId)}`, input)).data,
    onSuccess: refresh,
  });
}

export function useInstallReceiver(receiverId: Id) {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: async (input: { model: Id; slot: string; move?: boolean }) =>
      (await api.post<Installed>(`/api/receivers/${encodeURIComponent(receiverId)}/install`, input)).data,
    onSuccess: (data) => refresh(data.receiver),
  });
}

export function useRemoveReceiver(receiverId: Id) {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: async () =>
      (
        await api.post<{ receiver: ShelfUnit; install: UnitInstall }>(
          `/api/receivers/${encodeURIComponent(receiverId)}/remove`,
        )
      ).data,
    onSuccess: (data) => refresh(data.receiver),
  });
}

/** "I have applied these settings", for the revision whose check the pilot worked from. */
export function useApplySettings(receiverId: Id) {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: async (input: { revision: Id }) =>
      (await api.post<Applied>(`/api/receivers/${encodeURIComponent(receiverId)}/apply`, input)).data,
    onSuccess: (data) => refresh(data.receiver),
  });
}
