import { useId, useRef } from 'react';
import { buttonClasses } from '../../../components/ui/button';
import { cx } from '../../../components/ui/cx';
import type { PhotoDraft } from '../hooks/use-photo-drafts';
import type { usePhotoDrafts } from '../hooks/use-photo-drafts';

function sizeText(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
  return `${Math.max(1, Math.round(bytes / 1024))} KB`;
}

function statusText(draft: PhotoDraft): string {
  switch (draft.status) {
    case 'preparing':
      return 'Making it lighter to send…';
    case 'ready':
      return draft.blob ? `Ready, ${sizeText(draft.blob.size)} (was ${sizeText(draft.originalBytes)})` : 'Ready';
    case 'uploading':
      return `Sending… ${Math.round(draft.progress * 100)} %`;
    case 'sent':
      return 'Sent';
    case 'failed':
      return draft.error ?? 'Could not be sent';
  }
}

/** Choose several photos, see them, remove any before sending, and watch each one go up. */
export function PhotoPicker({
  photos,
  label = 'Photos',
  hint = 'Up to 6 photos. Close-ups of the surface and one of the whole jar help most. They are made lighter before sending, and only you and the mentors can see them.',
  disabled,
}: {
  photos: ReturnType<typeof usePhotoDrafts>;
  label?: string;
  hint?: string;
  disabled?: boolean;
}) {
  const inputId = useId();
  const hintId = `${inputId}-hint`;
  const inputRef = useRef<HTMLInputElement>(null);
  const shown = photos.drafts;
  const full = shown.filter((d) => d.status !== 'sent').length >= photos.limit;

  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="font-bold">{label}</legend>
      <p id={hintId} className="text-base text-loam-soft">
        {hint}
      </p>
      <div>
        {/* A real file input, visually replaced by a button-like label: it stays keyboard- and screen-reader-usable. */}
        <input
          ref={inputRef}
          id={inputId}
          type="file"
          accept="image/jpeg,image/png,image/webp,image/heic,image/heif"
          multiple
          disabled={disabled || full}
          aria-describedby={hintId}
          className="peer sr-only"
          onChange={(event) => {
            if (event.target.files?.length) photos.add(event.target.files);
            event.target.value = '';
          }}
        />
        <label
          htmlFor={inputId}
          className={cx(
            buttonClasses('secondary'),
            'cursor-pointer peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-loam',
            (disabled || full) && 'cursor-not-allowed opacity-60',
          )}
        >
          <CameraIcon />
          {shown.length ? 'Add more photos' : 'Add photos'}
        </label>
      </div>
      {photos.notice && (
        <p role="status" className="font-semibold text-clay-deep">
          {photos.notice}
        </p>
      )}
      {shown.length > 0 && (
        <ul className="grid grid-cols-1 gap-3 sm:grid-cols-2" aria-label="Chosen photos">
          {shown.map((draft, index) => (
            <li key={draft.key} className="flex gap-3 rounded-soft border border-line bg-rice p-2">
              <img
                src={draft.previewUrl}
                alt={`Photo ${index + 1} of your batch`}
                className="size-20 shrink-0 rounded-soft object-cover"
              />
              <div className="flex min-w-0 flex-1 flex-col gap-1">
                <p className="truncate text-sm font-bold" title={draft.name}>
                  {draft.name}
                </p>
                <p className={cx('text-sm', draft.status === 'failed' ? 'font-semibold text-ember' : 'text-loam-soft')}>
                  {statusText(draft)}
                </p>
                {(draft.status === 'uploading' || draft.status === 'sent') && (
                  <progress
                    max={1}
                    value={draft.progress}
                    aria-label={`Sending ${draft.name}`}
                    className="h-2 w-full overflow-hidden rounded-full accent-moss [&::-webkit-progress-bar]:bg-rice-deep [&::-webkit-progress-value]:bg-moss"
                  />
                )}
                {draft.status !== 'uploading' && draft.status !== 'sent' && (
                  <button
                    type="button"
                    onClick={() => photos.remove(draft.key)}
                    disabled={disabled}
                    className="mt-auto inline-flex min-h-11 items-center self-start rounded-soft px-2 text-sm font-bold text-moss-deep underline underline-offset-4 hover:bg-moss-mist disabled:cursor-not-allowed disabled:no-underline disabled:opacity-60"
                  >
                    Remove<span className="sr-only"> {draft.name}</span>
                  </button>
                )}
              </div>
            </li>
          ))}
        </ul>
      )}
    </fieldset>
  );
}

function CameraIcon() {
  return (
    <svg aria-hidden="true" viewBox="0 0 24 24" className="size-5" fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round">
      <path d="M4 8h3l2-3h6l2 3h3v11H4z" />
      <circle cx="12" cy="13" r="3.5" />
    </svg>
  );
}
