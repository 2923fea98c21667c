import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { AssessmentDto, MoveInput } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { moveKeys } from './keys';

/** Runs the full assessment on a draft; nothing is saved. */
export const previewMove = (body: MoveInput, signal?: AbortSignal) => api<AssessmentDto>('/moves/preview', { method: 'POST', json: body, signal });

export const previewQueryOptions = (body: MoveInput | null) =>
  queryOptions({
    queryKey: moveKeys.preview(body),
    queryFn: ({ signal }) => previewMove(body as MoveInput, signal),
    enabled: body !== null,
    placeholderData: keepPreviousData,
    staleTime: 60_000,
    retry: false,
  });

export const usePreviewMove = (body: MoveInput | null) => useQuery(previewQueryOptions(body));
