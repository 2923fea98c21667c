import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TractorDto, TractorInput } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { fleetKeys } from './keys';

export const createTractor = (body: TractorInput) => api<TractorDto>('/fleet/tractors', { method: 'POST', json: body });

export const useCreateTractor = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createTractor, onSuccess: () => qc.invalidateQueries({ queryKey: fleetKeys.tractors() }) });
};
