// Photos added mid-thread go up to the case like any other (POST /api/cases/:id/photos) but
// marked as the thread's, then ride on the message that shows them (`photoIds`). XMLHttpRequest
// for the progress bar: on a weak rural connection a grower needs to see it moving.
import type { PhotoView } from '@shared/case-schemas';
import { ApiError, UNREACHABLE_MESSAGE } from '../../../lib/api-client';

function failure(xhr: XMLHttpRequest): ApiError {
  let error: { code?: unknown; message?: unknown; fields?: Record<string, string> } | undefined;
  try {
    error = (JSON.parse(xhr.responseText) as { error?: typeof error }).error;
  } catch {
    error = undefined;
  }
  if (typeof error?.code === 'string' && typeof error.message === 'string') return new ApiError(xhr.status, error.code, error.message, error.fields);
  return new ApiError(xhr.status, 'upload_failed', xhr.status === 413 ? 'That photo is too large to send.' : 'The photo could not be sent.');
}

export function uploadThreadPhoto(caseId: number, file: File, onProgress: (share: number) => void): Promise<PhotoView[]> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    form.append('purpose', 'thread');
    form.append('photos', file, file.name);
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/cases/${caseId}/photos`);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (event) => event.lengthComputable && onProgress(event.loaded / event.total);
    xhr.onerror = () => reject(new ApiError(0, 'network_unreachable', UNREACHABLE_MESSAGE));
    xhr.onload = () => {
      if (xhr.status < 200 || xhr.status >= 300) return reject(failure(xhr));
      try {
        resolve((JSON.parse(xhr.responseText) as { photos: PhotoView[] }).photos);
      } catch {
        reject(new ApiError(xhr.status, 'bad_answer', 'The server answered in a way we did not expect.'));
      }
    };
    xhr.send(form);
  });
}
