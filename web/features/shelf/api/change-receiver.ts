import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateReceiverInput, UpdateReceiverInput } from '@shared/reuse/receiver-fields';
import { api } from '../../../lib/api-client';
import type { Id } from '../../../types/api';
import type { Applied, Installed, ShelfUnit, UnitInstall } from '../types';
import { receiverQueryKey } from './get-receiver';
import { paths } from '../../../lib/api-paths';

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
      (await api.post<ShelfUnit>(paths.workspaceReceivers(workspaceId), input)).data,
    onSuccess: refresh,
  });
}

export function useUpdateReceiver(receiverId: Id) {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: async (input: UpdateReceiverInput) =>
      (await api.patch<ShelfUnit>(paths.receiver(receiverId), input)).data,
    onSuccess: refresh,
  });
}

export function useInstallReceiver(receiverId: Id) {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: async (input: { model: Id; slot: string; move?: boolean }) =>
      (await api.post<Installed>(paths.receiverInstall(receiverId), input)).data,
    onSuccess: (data) => refresh(data.receiver),
  });
}

export function useRemoveReceiver(receiverId: Id) {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: async () =>
      (await api.post<{ receiver: ShelfUnit; install: UnitInstall }>(paths.receiverRemove(receiverId))).data,
    onSuccess: (data) => refresh(data.receiver),
  });
}

/** "I have applied these settings", for the revision whose check the pilot worked from. */
export function useApplySettings(receiverId: Id) {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: async (input: { revision: Id }) =>
      (await api.post<Applied>(paths.receiverApply(receiverId), input)).data,
    onSuccess: (data) => refresh(data.receiver),
  });
}
