import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TractorDto, TractorInput } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { fleetKeys } from './keys';

/** Replaces the tractor's spec; a stale `version` is refused with 409. */
export const updateTractor = ({ id, version, body }: { id: string; version: number; body: TractorInput }) =>
  api<TractorDto>(`/fleet/tractors/${id}?version=${version}`, { method: 'PUT', json: body });

export const useUpdateTractor = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateTractor, onSuccess: () => qc.invalidateQueries({ queryKey: fleetKeys.tractors() }) });
};
