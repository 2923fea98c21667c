import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { PaymentsPage, PaymentsQuery } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { downloadFile } from './download-file';
import { permitKeys } from './keys';

export type PaymentsFilter = Required<Pick<PaymentsQuery, 'page' | 'pageSize'>> & Omit<PaymentsQuery, 'page' | 'pageSize'>;

const params = (f: Partial<PaymentsFilter>) => {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(f)) if (v !== undefined && v !== '') q.set(k, String(v));
  return q;
};

export const getPayments = (f: PaymentsFilter) => api<PaymentsPage>(`/payments?${params(f)}`);

export const paymentsQueryOptions = (f: PaymentsFilter) =>
  queryOptions({ queryKey: permitKeys.paymentList(f), queryFn: () => getPayments(f), placeholderData: keepPreviousData });

export const usePayments = (f: PaymentsFilter) => useQuery(paymentsQueryOptions(f));

/** The ledger (same filters, every page) as a CSV download. */
export const downloadPaymentsCsv = (f: Omit<PaymentsFilter, 'page' | 'pageSize'>) => downloadFile(`/payments/export.csv?${params(f)}`, 'payments.csv');
