import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ApiErrorBody, PermitDocumentDto } from '@amberline/common';
import { ApiError, tokenStore } from '../../../lib/api-client';
import { invalidatePermitData } from './invalidate';

export type UploadInput = { permitId: string; file: File; onProgress?: (percent: number) => void };

/** Multipart upload through XMLHttpRequest, which reports upload progress (fetch does not). */
export function uploadPermitDocument({ permitId, file, onProgress }: UploadInput): Promise<PermitDocumentDto> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/permits/${permitId}/documents`);
    const token = tokenStore.get();
    if (token) xhr.setRequestHeader('authorization', `Bearer ${token}`);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress?.(Math.round((e.loaded / e.total) * 100));
    };
    xhr.onload = () => {
      let body: unknown;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : undefined;
      } catch {
        body = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) resolve(body as PermitDocumentDto);
      else reject(new ApiError(xhr.status, (body as ApiErrorBody) ?? { statusCode: xhr.status, error: 'internal_error', message: xhr.statusText || 'Upload failed' }));
    };
    xhr.onerror = () => reject(new Error('The upload did not reach the server'));
    const form = new FormData();
    form.append('file', file, file.name);
    xhr.send(form);
  });
}

export const useUploadPermitDocument = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: uploadPermitDocument, onSuccess: () => invalidatePermitData(qc) });
};
