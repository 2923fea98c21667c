import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PaymentDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { invalidatePermitData } from './invalidate';

export const refundPermit = ({ permitId, reason }: { permitId: string; reason: string }) =>
  api<PaymentDto>(`/permits/${permitId}/refunds`, { method: 'POST', json: { reason } });

export const useRefundPermit = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: refundPermit, onSuccess: () => invalidatePermitData(qc) });
};
