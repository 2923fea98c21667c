import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ReassessmentPreview } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { moveKeys } from './keys';

export const getReassessment = (id: string) => api<ReassessmentPreview>(`/moves/${id}/reassessment`);

export const reassessmentQueryOptions = (id: string) =>
  queryOptions({ queryKey: moveKeys.reassessment(id), queryFn: () => getReassessment(id) });

/** Fetched only when asked for (the dispatcher opens the re-assessment dialog). */
export const useReassessment = (id: string, enabled: boolean) => useQuery({ ...reassessmentQueryOptions(id), enabled });
