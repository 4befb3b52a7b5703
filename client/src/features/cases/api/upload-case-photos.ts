// Photos go up as multipart through XMLHttpRequest rather than the JSON api client: fetch gives
// no upload progress, and a grower on a weak rural connection needs to see that it is moving.
import { ApiError, UNREACHABLE_MESSAGE } from '../../../lib/api-client';
import type { PhotoView } from '@shared/case-schemas';
import { PHOTO_LIMITS } from '@shared/photo-limits';

/** What the server takes in one request (POST /api/cases/:id/photos). */
export const MAX_PHOTOS_PER_UPLOAD = PHOTO_LIMITS.maxFiles;
export const MAX_PHOTO_BYTES = PHOTO_LIMITS.maxFileBytes;

export interface UploadProgress {
  loaded: number;
  total: number;
}

function errorFrom(xhr: XMLHttpRequest): ApiError {
  let body: unknown;
  try {
    body = JSON.parse(xhr.responseText);
  } catch {
    body = undefined;
  }
  const error = (body as { error?: { code?: unknown; message?: unknown; fields?: Record<string, string> } } | undefined)?.error;
  if (error && typeof error.code === 'string' && typeof error.message === 'string') {
    return new ApiError(xhr.status, error.code, error.message, error.fields);
  }
  if (xhr.status === 413) return new ApiError(413, 'too_large', 'That photo is too large to send.');
  return new ApiError(xhr.status, 'upload_failed', 'The photo could not be sent. Try again in a moment.');
}

/** Sends photos to a case, reporting progress of the whole request. */
export function uploadCasePhotos(
  caseId: number,
  files: readonly Blob[],
  options: { onProgress?: (progress: UploadProgress) => void; signal?: AbortSignal } = {},
): Promise<{ photos: PhotoView[] }> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    files.forEach((file, i) => form.append('photos', file, file instanceof File ? file.name : `photo-${i + 1}.jpg`));

    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/cases/${caseId}/photos`);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) options.onProgress?.({ loaded: event.loaded, total: event.total });
    };
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        try {
          resolve(JSON.parse(xhr.responseText) as { photos: PhotoView[] });
        } catch {
          reject(new ApiError(xhr.status, 'bad_answer', 'The server answered in a way we did not expect.'));
        }
      } else {
        reject(errorFrom(xhr));
      }
    };
    xhr.onerror = () => reject(new ApiError(0, 'network_unreachable', UNREACHABLE_MESSAGE));
    xhr.onabort = () => reject(new DOMException('The upload was cancelled.', 'AbortError'));
    options.signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}
