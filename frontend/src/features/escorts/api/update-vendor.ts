import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UpdateVendorRequest, VendorDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { escortKeys } from './keys';

export const updateVendor = ({ id, ...body }: UpdateVendorRequest & { id: string }) => api<VendorDto>(`/vendors/${id}`, { method: 'PUT', json: body });

export const useUpdateVendor = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateVendor, onSuccess: () => qc.invalidateQueries({ queryKey: escortKeys.vendors() }) });
};
