// One photo of how the batch looks now, sent with purpose "recovery" so the report can name it.
// (The case's own uploader sends case photos; a report needs the new photo's id back.)
import { ApiError, UNREACHABLE_MESSAGE } from '../../../lib/api-client';

export async function uploadRecoveryPhoto(caseId: number, photo: Blob, name: string): Promise<number> {
  const form = new FormData();
  form.append('purpose', 'recovery');
  form.append('photos', photo instanceof File ? photo : new File([photo], name, { type: photo.type || 'image/jpeg' }));
  let response: Response;
  try {
    response = await fetch(`/api/cases/${caseId}/photos`, { method: 'POST', body: form, credentials: 'same-origin', headers: { Accept: 'application/json' } });
  } catch {
    throw new ApiError(0, 'network_unreachable', UNREACHABLE_MESSAGE);
  }
  const body = (await response.json().catch(() => null)) as { photos?: { id: number }[]; error?: { code: string; message: string } } | null;
  if (!response.ok || !body?.photos?.[0]) {
    throw new ApiError(response.status, body?.error?.code ?? 'upload_failed', body?.error?.message ?? 'The photo could not be sent. Try again in a moment.');
  }
  return body.photos[0].id;
}
