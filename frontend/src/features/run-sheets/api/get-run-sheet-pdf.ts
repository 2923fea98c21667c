import { useMutation } from '@tanstack/react-query';
import type { ApiErrorBody } from '@amberline/common';
import { ApiError, tokenStore } from '../../../lib/api-client';

/** The printable PDF. The API wants the bearer token, so it is fetched as a blob rather than linked. */
export async function getRunSheetPdf(moveId: string): Promise<Blob> {
  const headers = new Headers();
  const token = tokenStore.get();
  if (token) headers.set('authorization', `Bearer ${token}`);
  const res = await fetch(`/api/moves/${moveId}/run-sheet.pdf`, { headers });
  if (!res.ok) {
    const text = await res.text();
    let body: ApiErrorBody;
    try {
      body = JSON.parse(text) as ApiErrorBody;
    } catch {
      body = { statusCode: res.status, error: 'internal_error', message: res.statusText } as ApiErrorBody;
    }
    throw new ApiError(res.status, body);
  }
  return res.blob();
}

/**
 * Opens the PDF in a new tab. The tab is opened before the download (inside the click) so phone browsers do not
 * block it as a pop-up, then pointed at the blob.
 */
export const useOpenRunSheetPdf = () =>
  useMutation({
    mutationFn: async (moveId: string) => {
      const tab = window.open('', '_blank');
      try {
        const blob = await getRunSheetPdf(moveId);
        const url = URL.createObjectURL(blob);
        if (tab) tab.location.href = url;
        else window.location.assign(url);
        setTimeout(() => URL.revokeObjectURL(url), 60_000);
        return url;
      } catch (e) {
        tab?.close();
        throw e;
      }
    },
  });
