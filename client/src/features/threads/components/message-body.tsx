import { splitLinks } from '../lib/split-links';

/** A message body: plain text with its line breaks; web addresses become links, nothing else
 * is ever read as markup. */
export function MessageBody({ body }: { body: string }) {
  return (
    <p className="whitespace-pre-wrap break-words [overflow-wrap:anywhere]">
      {splitLinks(body).map((part, i) =>
        part.kind === 'link' ? (
          <a key={i} href={part.href} target="_blank" rel="noopener noreferrer nofollow ugc">
            {part.text}
          </a>
        ) : (
          <span key={i}>{part.text}</span>
        ),
      )}
    </p>
  );
}
