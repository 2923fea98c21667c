import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TrailerDto, TrailerInput } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { fleetKeys } from './keys';

export const createTrailer = (body: TrailerInput) => api<TrailerDto>('/fleet/trailers', { method: 'POST', json: body });

export const useCreateTrailer = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createTrailer, onSuccess: () => qc.invalidateQueries({ queryKey: fleetKeys.trailers() }) });
};
