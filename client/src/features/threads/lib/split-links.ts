// Message bodies are plain text. The only thing turned into markup is a web address, and only
// http(s): anything else (javascript:, data:, file:) stays text.
export type BodyPart = { kind: 'text'; text: string } | { kind: 'link'; text: string; href: string };

const URL_PATTERN = /\bhttps?:\/\/[^\s<>"'`]+/gi;
// Sentence punctuation right after an address belongs to the sentence, not the address.
const TRAILING = /[.,;:!?'")\]}]+$/;

function safeHref(candidate: string): string | null {
  try {
    const url = new URL(candidate);
    return url.protocol === 'http:' || url.protocol === 'https:' ? url.href : null;
  } catch {
    return null;
  }
}

export function splitLinks(body: string): BodyPart[] {
  const parts: BodyPart[] = [];
  let last = 0;
  for (const match of body.matchAll(URL_PATTERN)) {
    let text = match[0];
    const start = match.index;
    // Keep a closing bracket that has its opening partner inside the address (wiki-style links).
    const trailing = TRAILING.exec(text)?.[0] ?? '';
    if (trailing) {
      let keep = 0;
      if (trailing.startsWith(')') && text.includes('(')) keep = 1;
      text = text.slice(0, text.length - trailing.length + keep);
    }
    const href = safeHref(text);
    if (!href) continue;
    if (start > last) parts.push({ kind: 'text', text: body.slice(last, start) });
    parts.push({ kind: 'link', text, href });
    last = start + text.length;
  }
  if (last < body.length) parts.push({ kind: 'text', text: body.slice(last) });
  return parts;
}
