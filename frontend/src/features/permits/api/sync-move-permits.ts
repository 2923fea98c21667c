import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SyncPermitsResponse } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { invalidatePermitData } from './invalidate';

export const syncMovePermits = (moveId: string) => api<SyncPermitsResponse>(`/moves/${moveId}/permits/sync`, { method: 'POST' });

export const useSyncMovePermits = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: syncMovePermits, onSuccess: () => invalidatePermitData(qc) });
};
