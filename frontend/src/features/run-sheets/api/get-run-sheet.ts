import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RunSheetDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { runSheetKeys } from './keys';

export const getRunSheet = (moveId: string) => api<RunSheetDto>(`/moves/${moveId}/run-sheet`);

export const runSheetQueryOptions = (moveId: string) =>
  queryOptions({ queryKey: runSheetKeys.one(moveId), queryFn: () => getRunSheet(moveId) });

export const useRunSheet = (moveId: string | undefined) => useQuery({ ...runSheetQueryOptions(moveId ?? ''), enabled: !!moveId });
