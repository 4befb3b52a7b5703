import type { ReactNode } from 'react';
import type { ThreadMessage } from '@shared/socket-events';
import { Button } from '../../../components/ui/button';
import { cx } from '../../../components/ui/cx';
import { ROLE_LABELS } from '../../../lib/auth';
import type { PendingMessage } from '../lib/outbox';
import { fullTime, messageTime } from '../lib/time-words';
import { ReportMessageButton } from '../../moderation/components/report-message-button';
import { MessageBody } from './message-body';

export const ASIDE_LABEL = 'Mentor aside — growers never see this';

function Stamp({ iso }: { iso: string }) {
  return (
    <time dateTime={iso} title={fullTime(iso)}>
      {messageTime(iso)}
    </time>
  );
}

function Bubble({ mine, aside, className, children }: { mine: boolean; aside: boolean; className?: string; children: ReactNode }) {
  return (
    <div
      className={cx(
        'w-fit max-w-[min(92%,40rem)] rounded-soft px-4 py-3',
        mine ? 'ml-auto' : 'mr-auto',
        aside
          ? 'border-2 border-dashed border-clay bg-clay-mist'
          : mine
            ? 'border border-moss bg-moss-mist'
            : 'border border-line bg-rice-deep',
        className,
      )}
    >
      {children}
    </div>
  );
}

function AsideLabel() {
  return (
    <p className="mb-1 flex items-center gap-1.5 text-sm font-extrabold text-clay-deep">
      <svg aria-hidden="true" viewBox="0 0 24 24" className="size-4 shrink-0" fill="none" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round">
        <path d="M3 3l18 18M10.6 5.1A9.8 9.8 0 0 1 12 5c5 0 8.5 4.5 9.5 7a12 12 0 0 1-2.6 3.7M6.3 6.4C4.3 7.8 3 9.9 2.5 12c1 2.5 4.5 7 9.5 7 1.6 0 3-.4 4.3-1.1" />
      </svg>
      {ASIDE_LABEL}
    </p>
  );
}

export function MessageItem({ message, mine }: { message: ThreadMessage; mine: boolean }) {
  if (message.kind === 'system') {
    // Most system lines already say who acted; the others get the name beside them.
    const who = message.author && !message.body.includes(message.author.displayName) ? message.author.displayName : null;
    return (
      <li className="flex justify-center px-2 py-1">
        <p className="max-w-prose text-center text-base text-loam-soft">
          <span className="italic">{message.body}</span> <span aria-hidden="true">·</span>{' '}
          {who && (
            <>
              <span>{mine ? 'you' : who}</span> <span aria-hidden="true">·</span>{' '}
            </>
          )}
          <span className="whitespace-nowrap text-sm">
            <Stamp iso={message.createdAt} />
          </span>
        </p>
      </li>
    );
  }

  const author = message.author;
  const aside = message.kind === 'aside';
  return (
    <li>
      <Bubble mine={mine} aside={aside}>
        {aside && <AsideLabel />}
        <p className="flex flex-wrap items-baseline gap-x-2 text-sm text-loam-soft">
          <span className="font-extrabold text-loam">{mine ? 'You' : (author?.displayName ?? 'Someone who left')}</span>
          {author && !mine && <span>{ROLE_LABELS[author.role]}</span>}
          <Stamp iso={message.createdAt} />
        </p>
        {message.hidden ? (
          <p className="mt-1 italic text-loam-soft">Hidden by a steward</p>
        ) : (
          <>
            <div className="mt-1">
              <MessageBody body={message.body} />
            </div>
            {message.photos.length > 0 && (
              <ul className="mt-2 flex flex-wrap gap-2" aria-label="Photos with this message">
                {message.photos.map((photo, i) => (
                  <li key={photo.id}>
                    <a href={photo.url} target="_blank" rel="noopener noreferrer" className="block rounded-soft">
                      <img
                        src={photo.thumbUrl}
                        alt={`Photo ${i + 1} from ${mine ? 'you' : (author?.displayName ?? 'the thread')}`}
                        width={photo.width}
                        height={photo.height}
                        loading="lazy"
                        className="h-28 w-auto max-w-full rounded-soft border border-line object-cover"
                      />
                    </a>
                  </li>
                ))}
              </ul>
            )}
            {!mine && (
              <ReportMessageButton messageId={message.id} authorName={author?.displayName} className="mt-2" />
            )}
          </>
        )}
      </Bubble>
    </li>
  );
}

const PENDING_WORDS: Record<PendingMessage['state'], string> = {
  sending: 'sending…',
  waiting: 'waiting for the connection — it will send by itself',
  failed: 'not sent',
};

/** A message of ours the server has not confirmed yet. */
export function PendingItem({ message, onRetry }: { message: PendingMessage; onRetry: () => void }) {
  const failed = message.state === 'failed';
  return (
    <li>
      <Bubble mine aside={message.kind === 'aside'} className={cx(!failed && 'opacity-80', failed && 'border-ember')}>
        {message.kind === 'aside' && <AsideLabel />}
        <p className="flex flex-wrap items-baseline gap-x-2 text-sm text-loam-soft">
          <span className="font-extrabold text-loam">You</span>
          <span className={cx(failed ? 'font-bold text-ember' : 'italic')}>{PENDING_WORDS[message.state]}</span>
        </p>
        <div className="mt-1">
          <MessageBody body={message.body} />
        </div>
        {failed && (
          <div className="mt-2 flex flex-wrap items-center gap-x-3 gap-y-1">
            {message.error && <p className="text-sm font-semibold text-ember">{message.error}</p>}
            <Button variant="secondary" className="px-3! py-1! text-sm!" onClick={onRetry}>
              Not sent — retry
            </Button>
          </div>
        )}
      </Bubble>
    </li>
  );
}
