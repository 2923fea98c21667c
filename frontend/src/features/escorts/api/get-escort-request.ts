import { queryOptions, useQuery } from '@tanstack/react-query';
import type { EscortRequestView } from '@amberline/common';
import { api, ApiError } from '../../../lib/api-client';
import { escortKeys } from './keys';

/** Public: the request behind a vendor's link (no sign-in; the token is the credential). */
export const getEscortRequest = (token: string) => api<EscortRequestView>(`/escort-responses/${encodeURIComponent(token)}`);

export const escortRequestQueryOptions = (token: string) =>
  queryOptions({
    queryKey: escortKeys.response(token),
    queryFn: () => getEscortRequest(token),
    retry: (n, e) => !(e instanceof ApiError && e.status < 500) && n < 2,
    staleTime: Infinity,
  });

export const useEscortRequest = (token: string) => useQuery(escortRequestQueryOptions(token));
