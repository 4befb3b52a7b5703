// A message's own id, made before it is sent, so a resend after a lost ack is recognised by
// the server and stored once. getRandomValues works on plain http too (a phone on the local
// network), where crypto.randomUUID is not available.
export function newClientId(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
}
