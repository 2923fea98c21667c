import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TrailerDto, TrailerInput } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { fleetKeys } from './keys';

/** Replaces the trailer's spec; a stale `version` is refused with 409. */
export const updateTrailer = ({ id, version, body }: { id: string; version: number; body: TrailerInput }) =>
  api<TrailerDto>(`/fleet/trailers/${id}?version=${version}`, { method: 'PUT', json: body });

export const useUpdateTrailer = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateTrailer, onSuccess: () => qc.invalidateQueries({ queryKey: fleetKeys.trailers() }) });
};
