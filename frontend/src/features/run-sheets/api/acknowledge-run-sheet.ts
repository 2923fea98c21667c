import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcknowledgeRequest, RunSheetDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { sharedKeys } from '../../../lib/shared-queries';
import { runSheetKeys } from './keys';

export const acknowledgeRunSheet = ({ moveId, ...body }: AcknowledgeRequest & { moveId: string }) =>
  api<RunSheetDto>(`/moves/${moveId}/run-sheet/acknowledgement`, { method: 'POST', json: body });

/** Acknowledges one version (fingerprint) of the run sheet; the answer is the sheet with its acknowledgement. */
export const useAcknowledgeRunSheet = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: acknowledgeRunSheet,
    onSuccess: (sheet, vars) => {
      qc.setQueryData(runSheetKeys.one(vars.moveId), sheet);
      return qc.invalidateQueries({ queryKey: sharedKeys.moves() });
    },
  });
};
