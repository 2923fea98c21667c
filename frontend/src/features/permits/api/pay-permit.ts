import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PaymentDto, PayPermitRequest } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { invalidatePermitData } from './invalidate';

export const payPermit = ({ permitId, ...body }: PayPermitRequest & { permitId: string }) =>
  api<PaymentDto>(`/permits/${permitId}/payments`, { method: 'POST', json: body });

/** A fresh key for one payment attempt; a retry of the same attempt sends the same key. */
export const newAttemptKey = (): string =>
  typeof crypto !== 'undefined' && 'randomUUID' in crypto ? crypto.randomUUID() : `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 12)}`;

export const usePayPermit = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: payPermit, onSuccess: () => invalidatePermitData(qc) });
};
