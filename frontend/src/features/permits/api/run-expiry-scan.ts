import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ExpiryScanResult } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { invalidatePermitData } from './invalidate';

export const runExpiryScan = () => api<ExpiryScanResult>('/permits/expiry-scan', { method: 'POST' });

export const useRunExpiryScan = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: runExpiryScan, onSuccess: () => invalidatePermitData(qc) });
};
