import { ROLES, type MemberRow, type Role } from '@scrap-relay/shared';
import { useId, useMemo, useState } from 'react';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { ConfirmDialog } from '../../../components/ui/dialog.tsx';
import { Input, Select } from '../../../components/ui/field.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { DataTable, dataTableColumns } from '../../../components/ui/table.tsx';
import { formatDate, ROLE_LABELS } from '../../../utils/format.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { useMembers } from '../api/get-members.ts';
import { useUpdateMember } from '../api/update-member.ts';
import { MemberRolesEditor } from './member-roles-editor.tsx';
import { NewQuilterToggle } from './new-quilter-toggle.tsx';
import { RowMessage } from './row-message.tsx';

const column = dataTableColumns<MemberRow>();

const roleFilterOptions = [
  { value: '', label: 'All roles' },
  ...ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] })),
];

const searchText = (member: MemberRow) => `${member.name} ${member.email}`;

export function MembersTable() {
  const members = useMembers();
  const [query, setQuery] = useState('');
  const [role, setRole] = useState<Role | ''>('');
  const [confirming, setConfirming] = useState<MemberRow | null>(null);
  const searchId = useId();
  const roleId = useId();
  const timeZone = useGuildTimeZone();

  const columns = useMemo(
    () =>
      column.columns([
        column.accessor('name', {
          header: 'Name',
          sortFn: 'text',
          cell: ({ row }) => <MemberName member={row.original} />,
          meta: { cellClassName: 'md:min-w-56' },
        }),
        column.accessor('joinedAt', {
          header: 'Joined',
          // ISO timestamps sort correctly as text.
          sortFn: 'text',
          sortDescFirst: true,
          meta: { sortLabels: ['Oldest first', 'Newest first'] },
          cell: ({ getValue }) => formatDate(getValue(), timeZone),
        }),
        column.accessor('roles', {
          header: 'Roles',
          enableSorting: false,
          filterFn: 'arrIncludes',
          cell: ({ row }) => <MemberRolesEditor member={row.original} />,
          meta: { cellClassName: 'md:min-w-64' },
        }),
        column.display({
          id: 'newQuilter',
          header: 'New quilter',
          cell: ({ row }) => <NewQuilterToggle member={row.original} />,
        }),
        column.display({
          id: 'account',
          header: 'Account',
          cell: ({ row }) => <AccountStatus member={row.original} onChange={setConfirming} />,
        }),
      ]),
    [timeZone],
  );

  // arrIncludes keeps rows whose roles include any of the values given.
  const columnFilters = useMemo(() => (role ? [{ id: 'roles', value: [role] }] : []), [role]);

  if (members.isPending) return <Loading label="Loading members…" />;
  if (members.isError) {
    return (
      <Alert tone="error" title="The member list could not be loaded">
        <p>{members.error.message}</p>
        <Button variant="secondary" onClick={() => members.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }

  return (
    <div className="space-y-6">
      <div role="search" aria-label="Find members" className="grid gap-4 rounded-stitch border-2 border-seam bg-muslin p-4 sm:grid-cols-[2fr_1fr]">
        <div className="space-y-1.5">
          <label htmlFor={searchId} className="block font-semibold">
            Search by name or e-mail
          </label>
          <Input id={searchId} type="search" value={query} onChange={(event) => setQuery(event.target.value)} autoComplete="off" />
        </div>
        <div className="space-y-1.5">
          <label htmlFor={roleId} className="block font-semibold">
            Role
          </label>
          <Select
            id={roleId}
            options={roleFilterOptions}
            value={role}
            onChange={(event) => setRole(event.target.value as Role | '')}
          />
        </div>
      </div>

      <DataTable
        caption="Guild members"
        data={members.data.items}
        columns={columns}
        getRowId={(member) => member.id}
        globalFilter={query}
        searchText={searchText}
        columnFilters={columnFilters}
        initialSorting={[{ id: 'name', desc: false }]}
        pageSize={25}
        noun={['member', 'members']}
        emptyMessage={query || role ? 'No member matches this search.' : 'The guild has no members yet.'}
      />

      {confirming ? <ActiveChangeDialog member={confirming} onClose={() => setConfirming(null)} /> : null}
    </div>
  );
}

function MemberName({ member }: { member: MemberRow }) {
  return (
    <div>
      <p className="font-semibold">{member.name}</p>
      <p className="text-thread-soft [overflow-wrap:anywhere]">{member.email}</p>
      {member.emailVerified ? null : <p className="text-ochre">E-mail not confirmed yet</p>}
    </div>
  );
}

function AccountStatus({ member, onChange }: { member: MemberRow; onChange: (member: MemberRow) => void }) {
  return (
    <div className="space-y-2">
      <p className={member.active ? 'font-semibold text-sage' : 'font-semibold text-madder-deep'}>
        {member.active ? 'Active' : 'Deactivated'}
      </p>
      {member.abilities.deactivate ? (
        <Button variant="secondary" onClick={() => onChange(member)}>
          {member.active ? 'Deactivate' : 'Reactivate'}
          <span className="sr-only"> {member.name}</span>
        </Button>
      ) : null}
    </div>
  );
}

function ActiveChangeDialog({ member, onClose }: { member: MemberRow; onClose: () => void }) {
  const update = useUpdateMember({ onSuccess: onClose });
  const deactivating = member.active;
  return (
    <ConfirmDialog
      open
      title={deactivating ? `Deactivate ${member.name}’s account?` : `Reactivate ${member.name}’s account?`}
      confirmLabel={deactivating ? 'Deactivate' : 'Reactivate'}
      pendingLabel={deactivating ? 'Deactivating…' : 'Reactivating…'}
      confirmVariant={deactivating ? 'danger' : 'primary'}
      isPending={update.isPending}
      onCancel={onClose}
      onConfirm={() => update.mutate({ memberId: member.id, data: { active: !deactivating } })}
    >
      <p>
        {deactivating
          ? `${member.name} will not be able to sign in until an admin reactivates the account.`
          : `${member.name} will be able to sign in again with their e-mail address and password.`}
      </p>
      {update.isError ? <RowMessage tone="error">{update.error.message}</RowMessage> : null}
    </ConfirmDialog>
  );
}
