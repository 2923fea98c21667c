import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { VendorDto, VendorInput } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { escortKeys } from './keys';

export const createVendor = (body: VendorInput) => api<VendorDto>('/vendors', { method: 'POST', json: body });

export const useCreateVendor = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createVendor, onSuccess: () => qc.invalidateQueries({ queryKey: escortKeys.vendors() }) });
};
