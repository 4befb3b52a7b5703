import { useId, useRef, useState, type FormEvent, type KeyboardEvent } from 'react';
import { MESSAGE_MAX } from '@shared/thread-limits';
import { Button, buttonClasses } from '../../../components/ui/button';
import { cx } from '../../../components/ui/cx';
import { isApiError } from '../../../lib/api-client';
import { grouped } from '../../../lib/english-numbers';
import { useTouchOnly } from '../../../lib/use-media-query';
import { usePhotoDrafts, type PhotoDraft } from '../../cases/hooks/use-photo-drafts';
import { useSendMessage } from '../api/send-message';
import { uploadThreadPhoto } from '../api/upload-thread-photos';
import { useTypingSignal } from '../hooks/use-live-thread';
import { ASIDE_LABEL } from './message-item';

/** The counter appears this close to the limit; earlier it would only be noise. */
const COUNT_FROM = MESSAGE_MAX - 500;

export interface ComposerProps {
  caseId: number;
  /** mentors and stewards (not on a case they opened themselves) may write asides */
  canAside: boolean;
  /** an ended case takes no more text; mentors may still keep asides on it */
  onlyAsides?: boolean;
  /** whose eyes a normal message reaches, for the label ("Write to Rowan") */
  audience: string;
}

function fileOf(draft: PhotoDraft): File {
  const blob = draft.blob!;
  return blob instanceof File ? blob : new File([blob], draft.name, { type: blob.type || 'image/jpeg' });
}

export function Composer({ caseId, canAside, onlyAsides = false, audience }: ComposerProps) {
  const id = useId();
  const textareaRef = useRef<HTMLTextAreaElement>(null);
  const [body, setBody] = useState('');
  // Stays on after sending: a second private note must not slip out to the grower because the
  // switch quietly turned itself off.
  const [asideChosen, setAsideChosen] = useState(false);
  const aside = onlyAsides || (canAside && asideChosen);
  const [error, setError] = useState<string | null>(null);
  const [uploading, setUploading] = useState<{ done: number; of: number; share: number } | null>(null);
  const photos = usePhotoDrafts();
  const { send } = useSendMessage(caseId);
  const typing = useTypingSignal(caseId);
  // By touch alone, Return starts a new line and the Send button sends.
  const touchOnly = useTouchOnly();

  const length = body.trim().length;
  const over = length > MESSAGE_MAX;
  const toSend = photos.drafts.filter((d) => d.blob && d.status !== 'sent');
  const busy = uploading !== null || photos.preparing;

  async function submit(event?: FormEvent) {
    event?.preventDefault();
    if (busy) return;
    const text = body.trim();
    if (!text && toSend.length === 0) {
      setError('Write something first.');
      textareaRef.current?.focus();
      return;
    }
    if (over) {
      setError(`Keep a message under ${grouped(MESSAGE_MAX)} characters, or send it in two parts.`);
      return;
    }
    setError(null);

    const photoIds: number[] = [];
    if (toSend.length) {
      setUploading({ done: 0, of: toSend.length, share: 0 });
      for (const [i, draft] of toSend.entries()) {
        try {
          const stored = await uploadThreadPhoto(caseId, fileOf(draft), (share) => setUploading({ done: i, of: toSend.length, share }));
          photoIds.push(...stored.map((p) => p.id));
          photos.remove(draft.key);
        } catch (failure) {
          setUploading(null);
          setError(`${isApiError(failure) ? failure.message : 'A photo could not be sent.'} Your words are kept; try again.`);
          return;
        }
      }
      setUploading(null);
    }

    const words = text || (photoIds.length === 1 ? 'Sent a photo.' : `Sent ${photoIds.length} photos.`);
    send(words, aside ? 'aside' : 'text', photoIds);
    setBody('');
    typing.stopped();
    textareaRef.current?.focus();
  }

  function onKeyDown(event: KeyboardEvent<HTMLTextAreaElement>) {
    // Enter sends; Shift+Enter is a new line; Enter that confirms an input method's word is neither.
    if (touchOnly || event.key !== 'Enter' || event.shiftKey || event.nativeEvent.isComposing) return;
    event.preventDefault();
    void submit();
  }

  const hintId = `${id}-hint`;
  const countId = `${id}-count`;
  const errorId = `${id}-error`;
  const fileId = `${id}-photos`;

  return (
    <form
      onSubmit={submit}
      aria-label={aside ? 'Write a mentor aside' : 'Write a message'}
      className={cx(
        'rounded-soft border-2 p-3 sm:p-4',
        aside ? 'border-dashed border-clay bg-clay-mist' : 'border-line bg-rice-deep',
      )}
    >
      <label htmlFor={`${id}-body`} className="font-bold">
        {aside ? 'Your mentor aside' : `Write to ${audience}`}
      </label>
      {aside && <p className="text-base font-semibold text-clay-deep">{ASIDE_LABEL}.</p>}
      <textarea
        ref={textareaRef}
        id={`${id}-body`}
        value={body}
        rows={3}
        enterKeyHint={touchOnly ? 'enter' : 'send'}
        aria-describedby={cx(hintId, length >= COUNT_FROM && countId, error && errorId) || undefined}
        aria-invalid={over || undefined}
        onChange={(event) => {
          setBody(event.target.value);
          if (error) setError(null);
          if (event.target.value.trim()) typing.keyPressed(aside);
          else typing.stopped();
        }}
        onKeyDown={onKeyDown}
        onBlur={typing.stopped}
        className={cx(
          'mt-1 block max-h-[50vh] min-h-24 w-full resize-y rounded-soft border-2 bg-rice px-3 py-2 text-lg text-loam',
          over ? 'border-ember' : 'border-loam-soft',
        )}
      />
      <div className="mt-1 flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <p id={hintId} className="text-sm text-loam-soft">
          {touchOnly
            ? `Tap ${aside ? 'Add aside' : 'Send'} when it is ready.`
            : 'Enter sends. Shift+Enter starts a new line.'}
        </p>
        <p id={countId} aria-live="polite" className={cx('text-sm font-semibold', over ? 'text-ember' : 'text-loam-soft')}>
          {length >= COUNT_FROM &&
            (over
              ? `${grouped(length - MESSAGE_MAX)} characters over the ${grouped(MESSAGE_MAX)} limit`
              : `${grouped(MESSAGE_MAX - length)} characters left`)}
        </p>
      </div>
      {error && (
        <p id={errorId} role="alert" className="mt-2 font-semibold text-ember">
          {error}
        </p>
      )}

      {(photos.drafts.length > 0 || photos.notice) && (
        <div className="mt-3">
          {photos.notice && (
            <p role="status" className="mb-2 font-semibold text-clay-deep">
              {photos.notice}
            </p>
          )}
          <ul className="flex flex-wrap gap-2" aria-label="Photos to send with this message">
            {photos.drafts.map((draft, i) => (
              <li key={draft.key} className="flex items-center gap-2 rounded-soft border border-line bg-rice p-1 pr-2">
                <img src={draft.previewUrl} alt={`Chosen photo ${i + 1}`} className="size-14 rounded-soft object-cover" />
                <span className="text-sm text-loam-soft">
                  {draft.status === 'preparing' ? 'Making it lighter…' : draft.status === 'failed' ? (draft.error ?? 'Could not be used') : 'Ready'}
                </span>
                <button
                  type="button"
                  onClick={() => photos.remove(draft.key)}
                  disabled={uploading !== null}
                  className="inline-flex min-h-11 items-center rounded-soft px-2 text-sm font-bold text-moss-deep underline underline-offset-4 hover:bg-moss-mist"
                >
                  Remove<span className="sr-only"> chosen photo {i + 1}</span>
                </button>
              </li>
            ))}
          </ul>
        </div>
      )}
      {uploading && (
        <div className="mt-2" role="status">
          <p className="text-sm text-loam-soft">
            Sending photo {uploading.done + 1} of {uploading.of}… {Math.round(uploading.share * 100)} %
          </p>
          <progress
            max={1}
            value={(uploading.done + uploading.share) / uploading.of}
            aria-label="Sending photos"
            className="h-2 w-full overflow-hidden rounded-full accent-moss [&::-webkit-progress-bar]:bg-rice [&::-webkit-progress-value]:bg-moss"
          />
        </div>
      )}

      <div className="mt-3 flex flex-wrap items-center gap-3">
        <div>
          {/* A real file input behind a button-like label: keyboard and screen readers keep it. */}
          <input
            id={fileId}
            type="file"
            accept="image/jpeg,image/png,image/webp,image/heic,image/heif"
            multiple
            disabled={uploading !== null || photos.drafts.length >= photos.limit}
            className="peer sr-only"
            onChange={(event) => {
              if (event.target.files?.length) photos.add(event.target.files);
              event.target.value = '';
            }}
          />
          <label
            htmlFor={fileId}
            className={cx(
              buttonClasses('secondary'),
              'cursor-pointer px-4! peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-loam',
              'peer-disabled:cursor-not-allowed peer-disabled:opacity-60',
            )}
          >
            <PictureIcon />
            Add photos
          </label>
        </div>
        {canAside && !onlyAsides && (
          <label className="inline-flex min-h-11 cursor-pointer items-center gap-2 rounded-soft px-1 font-bold text-clay-deep">
            <input
              type="checkbox"
              checked={asideChosen}
              onChange={(event) => setAsideChosen(event.target.checked)}
              className="size-5 accent-clay"
            />
            Mentor aside
          </label>
        )}
        <Button type="submit" className="ml-auto" disabled={busy}>
          {uploading ? 'Sending photos…' : aside ? 'Add aside' : 'Send'}
        </Button>
      </div>
    </form>
  );
}

function PictureIcon() {
  return (
    <svg aria-hidden="true" viewBox="0 0 24 24" className="size-5" fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round">
      <rect x="3" y="4" width="18" height="16" rx="2" />
      <path d="M3 17l5-5 4 4 3-3 6 6" />
      <circle cx="15.5" cy="8.5" r="1.5" />
    </svg>
  );
}
