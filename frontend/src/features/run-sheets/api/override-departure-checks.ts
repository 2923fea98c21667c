import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DepartureChecksDto, OverrideChecksRequest } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { runSheetKeys } from './keys';

export const overrideDepartureChecks = ({ moveId, checksId, ...body }: OverrideChecksRequest & { moveId: string; checksId: string }) =>
  api<DepartureChecksDto>(`/moves/${moveId}/departure-checks/${checksId}/override`, { method: 'POST', json: body });

/** A dispatcher lets checks blocked only by a gauge estimate pass, with a reason; the run sheet is refetched. */
export const useOverrideDepartureChecks = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: overrideDepartureChecks,
    onSuccess: (_d, vars) => qc.invalidateQueries({ queryKey: runSheetKeys.one(vars.moveId) }),
  });
};
