import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AssessmentDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { moveKeys } from './keys';

export const getAssessment = (id: string) => api<AssessmentDto>(`/moves/${id}/assessment`);

export const assessmentQueryOptions = (id: string) =>
  queryOptions({ queryKey: moveKeys.assessment(id), queryFn: () => getAssessment(id) });

export const useAssessment = (id: string) => useQuery(assessmentQueryOptions(id));
