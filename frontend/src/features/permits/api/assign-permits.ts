import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AssignPermitsRequest, AssignPermitsResponse } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { invalidatePermitData } from './invalidate';

export const assignPermits = (body: AssignPermitsRequest) => api<AssignPermitsResponse>('/permits/assign', { method: 'POST', json: body });

export const useAssignPermits = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: assignPermits, onSuccess: () => invalidatePermitData(qc) });
};
