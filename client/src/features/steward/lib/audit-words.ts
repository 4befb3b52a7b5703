// Audit rows in a steward's words: "Idris Wendleby changed Rowan's role from grower to mentor".
import type { AuditEntry } from '@shared/steward-schemas';
import type { Role } from '@shared/case-status';
import { ROLE_LABELS } from '../../../lib/auth';

const role = (value: unknown) => (typeof value === 'string' && value in ROLE_LABELS ? ROLE_LABELS[value as Role].toLowerCase() : String(value));
const quoted = (value: unknown) => (typeof value === 'string' && value.trim() ? `: “${value.trim()}”` : '');

/** What happened, after the actor's name. */
export function describeAudit(entry: AuditEntry): string {
  const target = entry.targetLabel ?? (entry.targetId ? `#${entry.targetId}` : 'someone');
  const d = entry.detail;
  switch (entry.action) {
    case 'user.role_changed':
      return `changed ${target}'s role from ${role(d.from)} to ${role(d.to)}${typeof d.reason === 'string' && d.reason.startsWith('mentor application') ? ' (mentor application approved)' : ''}`;
    case 'user.disabled':
      return `disabled ${target}'s account and ended their sessions`;
    case 'user.enabled':
      return `enabled ${target}'s account again`;
    case 'mentor_application.submitted':
      return 'applied to mentor';
    case 'mentor_application.approved':
      return `approved ${target}'s application to mentor${quoted(d.note)}`;
    case 'mentor_application.declined':
      return `declined ${target}'s application to mentor${quoted(d.note)}`;
    case 'message.reported':
      return `reported a message in “${target}”${quoted(d.reason)}`;
    case 'message.hidden':
      return `hid a message in “${target}”${quoted(d.note)}`;
    case 'message.shown_again':
      return `showed a hidden message in “${target}” again${quoted(d.note)}`;
    case 'field_note.taken_down':
      return `took the field note of “${target}” out of the Field Library${quoted(d.reason)}`;
    case 'field_note.restored':
      return `put the field note of “${target}” back in the Field Library`;
    case 'report.dismissed':
      return `dismissed a report about a message in “${target}”${quoted(d.note)}`;
    default:
      return `${entry.action.replace(/[._]/g, ' ')} ${target}`;
  }
}
