import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { VendorDto, VendorsQuery } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { escortKeys } from './keys';

export const getVendors = (f: VendorsQuery) => {
  const q = new URLSearchParams();
  if (f.search) q.set('search', f.search);
  if (f.state) q.set('state', f.state);
  if (f.includeInactive) q.set('includeInactive', 'true');
  return api<VendorDto[]>(`/vendors?${q}`);
};

export const vendorsQueryOptions = (f: VendorsQuery) =>
  queryOptions({ queryKey: escortKeys.vendorList(f), queryFn: () => getVendors(f), placeholderData: keepPreviousData });

export const useVendors = (f: VendorsQuery, enabled = true) => useQuery({ ...vendorsQueryOptions(f), enabled });
