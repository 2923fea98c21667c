import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DepartureChecksDto, DepartureChecksRequest } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { runSheetKeys } from './keys';

export const submitDepartureChecks = ({ moveId, ...body }: DepartureChecksRequest & { moveId: string }) =>
  api<DepartureChecksDto>(`/moves/${moveId}/departure-checks`, { method: 'POST', json: body });

/** Records the driver's departure checks; the run sheet is refetched so its latest checks follow. */
export const useSubmitDepartureChecks = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: submitDepartureChecks,
    onSuccess: (_d, vars) => qc.invalidateQueries({ queryKey: runSheetKeys.one(vars.moveId) }),
  });
};
