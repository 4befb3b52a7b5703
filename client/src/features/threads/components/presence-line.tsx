import type { PresenceEntry } from '@shared/socket-events';
import { ROLE_LABELS } from '../../../lib/auth';
import type { TypingPerson } from '../hooks/use-live-thread';

function listWords(names: string[]): string {
  if (names.length <= 1) return names.join('');
  return `${names.slice(0, -1).join(', ')} and ${names.at(-1)}`;
}

/** Who else has the thread open right now. */
export function PresenceLine({ present, myUserId }: { present: PresenceEntry[]; myUserId: number | null }) {
  const others = present.filter((p) => p.userId !== myUserId);
  return (
    <p className="flex flex-wrap items-center gap-x-2 gap-y-1 text-base text-loam-soft">
      <span aria-hidden="true" className={others.length ? 'inline-block size-2.5 rounded-full bg-moss' : 'inline-block size-2.5 rounded-full border-2 border-loam-soft'} />
      {others.length === 0 ? (
        'Nobody else has this thread open right now.'
      ) : (
        <>
          <span>Here now:</span>
          {others.map((p, i) => (
            <span key={p.userId} className="font-bold text-loam">
              {p.displayName}
              <span className="font-normal text-loam-soft"> ({ROLE_LABELS[p.role].toLowerCase()})</span>
              {i < others.length - 1 ? ',' : ''}
            </span>
          ))}
        </>
      )}
    </p>
  );
}

/** "Marta is typing…" — shown, not announced: it changes too often to read out. */
export function TypingLine({ typing }: { typing: TypingPerson[] }) {
  const names = typing.map((t) => t.displayName.split(' ')[0] || t.displayName);
  return (
    <p aria-hidden="true" className="min-h-7 text-base italic text-loam-soft">
      {names.length > 0 && `${listWords(names)} ${names.length === 1 ? 'is' : 'are'} typing…`}
    </p>
  );
}
