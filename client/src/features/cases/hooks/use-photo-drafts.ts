import { useCallback, useEffect, useRef, useState } from 'react';
// The library's worker loads the library itself by URL; serve our own copy instead of its CDN.
import compressionLibUrl from 'browser-image-compression/dist/browser-image-compression.js?url';
import { isApiError } from '../../../lib/api-client';
import { MAX_PHOTO_BYTES, MAX_PHOTOS_PER_UPLOAD, uploadCasePhotos } from '../api/upload-case-photos';

/** Phone photos are 3–12 MB; this is plenty for a mentor to see mould and still light on a weak
 * rural connection. */
export const DOWNSCALE = { maxWidthOrHeight: 2048, maxSizeMB: 1.5 } as const;

export type PhotoDraftStatus = 'preparing' | 'ready' | 'uploading' | 'sent' | 'failed';

export interface PhotoDraft {
  key: string;
  name: string;
  previewUrl: string;
  originalBytes: number;
  /** what will be sent: the downscaled copy, or the original when downscaling was not possible */
  blob: Blob | null;
  status: PhotoDraftStatus;
  /** 0–1 while uploading */
  progress: number;
  error: string | null;
}

const ACCEPTED = /^image\/(jpeg|png|webp|heic|heif)$/;

async function prepare(file: File): Promise<Blob> {
  try {
    // Loaded when the first photo is chosen, not with the page: most visits to a case add none.
    const { default: imageCompression } = await import('browser-image-compression');
    return await imageCompression(file, {
      ...DOWNSCALE,
      useWebWorker: true,
      libURL: new URL(compressionLibUrl, window.location.href).href,
      // Orientation is applied by drawing; the server strips every other tag anyway.
      preserveExif: false,
    });
  } catch {
    // A format the browser cannot draw (HEIC outside Safari): send the original and let the
    // server, which can read more formats, decide.
    if (file.size > MAX_PHOTO_BYTES) throw new Error('This photo could not be made smaller and is over 10 MB.');
    return file;
  }
}

let nextKey = 0;

/**
 * Photos chosen for a case before they are sent: previews, downscaling in the browser, then
 * one upload per photo with its own progress bar, so one failure does not sink the rest.
 */
export function usePhotoDrafts({ limit = MAX_PHOTOS_PER_UPLOAD }: { limit?: number } = {}) {
  const [drafts, setDrafts] = useState<PhotoDraft[]>([]);
  const draftsRef = useRef(drafts);
  draftsRef.current = drafts;
  const [notice, setNotice] = useState<string | null>(null);

  const update = useCallback((key: string, change: Partial<PhotoDraft>) => {
    setDrafts((all) => all.map((d) => (d.key === key ? { ...d, ...change } : d)));
  }, []);

  // Preview URLs hold memory until revoked.
  useEffect(() => () => draftsRef.current.forEach((d) => URL.revokeObjectURL(d.previewUrl)), []);

  const add = useCallback(
    (files: FileList | readonly File[]) => {
      const room = limit - draftsRef.current.filter((d) => d.status !== 'sent').length;
      const list = Array.from(files);
      const images = list.filter((f) => ACCEPTED.test(f.type) || /\.(jpe?g|png|webp|heic|heif)$/i.test(f.name));
      const messages: string[] = [];
      if (images.length < list.length) messages.push('Only photos (JPEG, PNG, WebP or HEIC) can be added.');
      if (images.length > room) messages.push(`Up to ${limit} photos at a time; the first ${Math.max(room, 0)} were kept.`);
      setNotice(messages.length ? messages.join(' ') : null);

      const taken = images.slice(0, Math.max(room, 0)).map<PhotoDraft & { file: File }>((file) => ({
        key: `photo-${++nextKey}`,
        name: file.name,
        previewUrl: URL.createObjectURL(file),
        originalBytes: file.size,
        blob: null,
        status: 'preparing',
        progress: 0,
        error: null,
        file,
      }));
      setDrafts((all) => [...all, ...taken.map(({ file: _file, ...draft }) => draft)]);
      for (const draft of taken) {
        prepare(draft.file).then(
          (blob) => update(draft.key, { blob, status: 'ready' }),
          (error: Error) => update(draft.key, { status: 'failed', error: error.message }),
        );
      }
    },
    [limit, update],
  );

  const remove = useCallback((key: string) => {
    setDrafts((all) => {
      const gone = all.find((d) => d.key === key);
      if (gone) URL.revokeObjectURL(gone.previewUrl);
      return all.filter((d) => d.key !== key);
    });
  }, []);

  const clearSent = useCallback(() => {
    setDrafts((all) => {
      all.filter((d) => d.status === 'sent').forEach((d) => URL.revokeObjectURL(d.previewUrl));
      return all.filter((d) => d.status !== 'sent');
    });
  }, []);

  /** Waits for downscaling to finish, then sends each photo in turn. Resolves with how many
   * went and how many did not; never rejects. */
  const uploadAll = useCallback(
    async (caseId: number): Promise<{ sent: number; failed: number }> => {
      await waitUntilPrepared(() => draftsRef.current);
      let sent = 0;
      let failed = 0;
      for (const draft of draftsRef.current) {
        // Removed while an earlier photo was going up.
        if (!draftsRef.current.some((d) => d.key === draft.key)) continue;
        if (draft.status !== 'ready' && !(draft.status === 'failed' && draft.blob)) {
          if (draft.status === 'failed') failed++;
          continue;
        }
        update(draft.key, { status: 'uploading', progress: 0, error: null });
        try {
          await uploadCasePhotos(caseId, [draftAsFile(draft)], {
            onProgress: ({ loaded, total }) => update(draft.key, { progress: total ? loaded / total : 0 }),
          });
          update(draft.key, { status: 'sent', progress: 1 });
          sent++;
        } catch (error) {
          const message = isApiError(error) ? error.message : 'The photo could not be sent.';
          update(draft.key, { status: 'failed', error: message });
          failed++;
        }
      }
      return { sent, failed };
    },
    [update],
  );

  const preparing = drafts.some((d) => d.status === 'preparing');
  const uploading = drafts.some((d) => d.status === 'uploading');
  const pending = drafts.filter((d) => d.status === 'ready' || d.status === 'preparing' || (d.status === 'failed' && d.blob)).length;

  return { drafts, notice, add, remove, clearSent, uploadAll, preparing, uploading, pending, limit };
}

function draftAsFile(draft: PhotoDraft): File {
  const blob = draft.blob!;
  if (blob instanceof File) return blob;
  return new File([blob], draft.name, { type: blob.type || 'image/jpeg' });
}

function waitUntilPrepared(read: () => PhotoDraft[]): Promise<void> {
  return new Promise((resolve) => {
    const tick = () => (read().some((d) => d.status === 'preparing') ? window.setTimeout(tick, 100) : resolve());
    tick();
  });
}
