import { useDeferredValue, useEffect, useState } from 'react';
import { Link } from 'react-router';
import { ROLES, isStaffRole, type Role } from '@shared/case-status';
import type { StewardUser } from '@shared/steward-schemas';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { ROLE_LABELS } from '../../../lib/auth';
import { useUser } from '../../auth/api/get-me';
import { useStewardUsers } from '../api/get-users';
import { useUpdateUser } from '../api/update-user';
import { formatDate } from '../lib/dates';
import { ConfirmDialog } from './confirm-dialog';
import { SelectField } from './form-controls';
import { DoneNotice, PagedList } from './paged-list';

type Pending = { user: StewardUser; role: Role } | { user: StewardUser; disabled: boolean };

const ROLE_WORDS: Record<Role, string> = {
  grower: 'They keep their batches and cases but can no longer answer on the rounds.',
  mentor: 'They see the rounds, can claim cases and leave mentor asides.',
  steward: 'They can change roles, hide messages and read everything on this desk.',
};

export function PeoplePanel() {
  const me = useUser().data;
  const [search, setSearch] = useState('');
  const [role, setRole] = useState<Role | ''>('');
  const [page, setPage] = useState(1);
  const q = useDeferredValue(search.trim());
  const users = useStewardUsers({ q: q || undefined, role: role || undefined, page });
  const update = useUpdateUser();
  const [pending, setPending] = useState<Pending | null>(null);
  const [done, setDone] = useState<string | null>(null);

  const ask = (next: Pending) => {
    setDone(null);
    update.reset();
    setPending(next);
  };

  const confirm = () => {
    if (!pending) return;
    const change = 'role' in pending ? { role: pending.role } : { disabled: pending.disabled };
    update.mutate(
      { id: pending.user.id, change },
      {
        onSuccess: (user) => {
          setDone(
            'role' in pending
              ? `${user.displayName} is now a ${ROLE_LABELS[user.role].toLowerCase()}.`
              : user.disabled
                ? `${user.displayName}'s account is disabled and every session of theirs has ended.`
                : `${user.displayName}'s account is enabled again. They need to sign in.`,
          );
          setPending(null);
        },
      },
    );
  };

  return (
    <div>
      <form role="search" aria-label="People" className="grid gap-4 sm:grid-cols-[1fr_14rem]" onSubmit={(e) => e.preventDefault()}>
        <TextField
          label="Search by name or e-mail"
          type="search"
          value={search}
          onChange={(e) => {
            setSearch(e.target.value);
            setPage(1);
          }}
          autoComplete="off"
        />
        <SelectField
          label="Role"
          value={role}
          onChange={(e) => {
            setRole(e.target.value as Role | '');
            setPage(1);
          }}
        >
          <option value="">Everyone</option>
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}s
            </option>
          ))}
        </SelectField>
      </form>

      <DoneNotice message={done} />
      <PagedList
        query={users}
        loadingLabel="Finding people…"
        errorTitle="The list of people could not be loaded"
        empty="Nobody matches that search."
        page={page}
        onPage={setPage}
        pagerLabel="Pages of people"
        above={(data) => (
          <p className="mb-3 text-loam-soft">
            {data.total} {data.total === 1 ? 'person' : 'people'}
          </p>
        )}
        className="flex flex-col divide-y divide-line rounded-soft border border-line bg-rice"
        itemClassName="flex flex-col gap-3 p-4 md:flex-row md:items-center"
        renderItem={(user) => (
          <PersonRow
            user={user}
            isMe={user.id === me?.id}
            onRole={(r) => ask({ user, role: r })}
            onDisabled={(disabled) => ask({ user, disabled })}
          />
        )}
      />

      <ConfirmDialog
        open={pending !== null}
        busy={update.isPending}
        title={
          !pending
            ? ''
            : 'role' in pending
              ? `Make ${pending.user.displayName} a ${ROLE_LABELS[pending.role].toLowerCase()}?`
              : pending.disabled
                ? `Disable ${pending.user.displayName}'s account?`
                : `Enable ${pending.user.displayName}'s account?`
        }
        confirmLabel={!pending ? '' : 'role' in pending ? `Make ${ROLE_LABELS[pending.role].toLowerCase()}` : pending.disabled ? 'Disable the account' : 'Enable the account'}
        confirmVariant={pending && 'disabled' in pending && pending.disabled ? 'danger' : 'primary'}
        onConfirm={confirm}
        onCancel={() => {
          setPending(null);
          update.reset();
        }}
      >
        {pending && 'role' in pending && <p>{ROLE_WORDS[pending.role]} The change takes effect at once, without them signing in again.</p>}
        {pending && 'disabled' in pending && (
          <p>
            {pending.disabled
              ? pending.user.id === me?.id
                ? 'This is your own account: you are signed out at once, everywhere, and another steward has to enable it again.'
                : 'They are signed out everywhere at once and cannot sign in until a steward enables the account. Their cases and messages stay.'
              : 'They will be able to sign in again.'}
          </p>
        )}
        {update.isError && (
          <Alert tone="danger" title="That did not go through">
            {update.error.message}
          </Alert>
        )}
      </ConfirmDialog>
    </div>
  );
}

function PersonRow({ user, isMe, onRole, onDisabled }: { user: StewardUser; isMe: boolean; onRole: (role: Role) => void; onDisabled: (disabled: boolean) => void }) {
  // Choosing in the list only picks; the button asks for confirmation, so arrowing through the
  // options never fires a change.
  const [chosen, setChosen] = useState<Role>(user.role);
  useEffect(() => setChosen(user.role), [user.role]);
  return (
    <>
      <div className="min-w-0 flex-1">
        <p className="flex flex-wrap items-center gap-x-2 font-extrabold">
          <span className="truncate">{user.displayName}</span>
          {isMe && <span className="text-base font-bold text-loam-soft">(you)</span>}
          {user.disabled && <span className="rounded-full bg-ember-mist px-2 text-sm font-bold text-ember">Disabled</span>}
        </p>
        <p className="truncate text-loam-soft">{user.email}</p>
        <p className="text-sm text-loam-soft">
          {ROLE_LABELS[user.role]} · joined {formatDate(user.createdAt)}
          {isStaffRole(user.role) && !user.disabled && (
            <>
              {' · '}
              <Link to={`/mentors/${user.id}`}>
                track record<span className="sr-only"> of {user.displayName}</span>
              </Link>
            </>
          )}
        </p>
      </div>
      <div className="flex flex-wrap items-end gap-3">
        <SelectField label={`Role for ${user.displayName}`} className="w-40 [&>label]:sr-only" value={chosen} onChange={(e) => setChosen(e.target.value as Role)}>
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </SelectField>
        <Button variant="secondary" disabled={chosen === user.role} onClick={() => onRole(chosen)}>
          Change role<span className="sr-only"> for {user.displayName}</span>
        </Button>
        <Button variant="quiet" onClick={() => onDisabled(!user.disabled)}>
          {user.disabled ? 'Enable' : 'Disable'}
          <span className="sr-only"> {user.displayName}&rsquo;s account</span>
        </Button>
      </div>
    </>
  );
}
