import { ApiError, tokenStore } from '../../../lib/api-client';

/** Fetches a protected file with the session token and hands it to the browser as a download. */
export async function downloadFile(path: string, fallbackName: string): Promise<void> {
  const token = tokenStore.get();
  const res = await fetch(`/api${path}`, { headers: token ? { authorization: `Bearer ${token}` } : {} });
  if (!res.ok) {
    const body = await res.json().catch(() => ({ statusCode: res.status, error: 'internal_error', message: res.statusText }));
    throw new ApiError(res.status, body);
  }
  const disposition = res.headers.get('content-disposition') ?? '';
  const name = /filename="([^"]+)"/.exec(disposition)?.[1] ?? fallbackName;
  const url = URL.createObjectURL(await res.blob());
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

export const downloadPermitDocument = (permitId: string, docId: string, fileName: string) => downloadFile(`/permits/${permitId}/documents/${docId}`, fileName);
