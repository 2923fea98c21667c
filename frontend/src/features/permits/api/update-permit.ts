import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PermitDto, UpdatePermitRequest } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { invalidatePermitData } from './invalidate';

export const updatePermit = ({ id, ...body }: UpdatePermitRequest & { id: string }) => api<PermitDto>(`/permits/${id}`, { method: 'PATCH', json: body });

export const useUpdatePermit = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updatePermit, onSuccess: () => invalidatePermitData(qc) });
};
