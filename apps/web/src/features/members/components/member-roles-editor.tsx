import { memberUpdateSchema, ROLES, type MemberRow, type Role } from '@scrap-relay/shared';
import { useState } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { Checkbox } from '../../../components/ui/field.tsx';
import { formatRoles, ROLE_LABELS } from '../../../utils/format.ts';
import { useUpdateMember } from '../api/update-member.ts';
import { RowMessage } from './row-message.tsx';

const sameRoles = (a: readonly Role[], b: readonly Role[]) => a.length === b.length && a.every((role) => b.includes(role));

/** Role boxes for one member, saved together; shown only where the row says roles may change. */
export function MemberRolesEditor({ member }: { member: MemberRow }) {
  const update = useUpdateMember();
  // null while untouched, so a fresh row from the server shows through.
  const [draft, setDraft] = useState<Role[] | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const roles = draft ?? member.roles;
  const changed = draft !== null && !sameRoles(draft, member.roles);

  if (!member.abilities.changeRoles) return <p>{formatRoles(member.roles, ROLES)}</p>;

  const toggle = (role: Role, on: boolean) => {
    update.reset();
    setProblem(null);
    setDraft(ROLES.filter((r) => (r === role ? on : roles.includes(r))));
  };

  const save = () => {
    const parsed = memberUpdateSchema.safeParse({ roles });
    if (!parsed.success) {
      setProblem(parsed.error.issues[0]?.message ?? 'These roles cannot be saved.');
      return;
    }
    update.mutate({ memberId: member.id, data: parsed.data }, { onSuccess: () => setDraft(null) });
  };

  return (
    <fieldset className="space-y-2">
      <legend className="sr-only">Roles for {member.name}</legend>
      <div className="grid grid-cols-2 gap-x-4">
        {ROLES.map((role) =>
          role === 'member' ? (
            // Every account keeps the member role (the schema refuses a save without it): shown, not offered.
            <p key={role} className="flex min-h-11 items-start gap-3 py-1">
              <span aria-hidden="true" className="mt-0.5 flex size-6 shrink-0 items-center justify-center rounded bg-thread-soft text-sm text-white">
                ✓
              </span>
              <span className="font-semibold">
                {ROLE_LABELS[role]}
                <span className="sr-only"> (every account)</span>
              </span>
            </p>
          ) : (
            <Checkbox
              key={role}
              label={ROLE_LABELS[role]}
              checked={roles.includes(role)}
              disabled={update.isPending}
              onChange={(event) => toggle(role, event.target.checked)}
            />
          ),
        )}
      </div>
      {changed ? (
        <div className="flex flex-wrap gap-2">
          <Button onClick={save} isPending={update.isPending} pendingLabel="Saving…">
            Save roles
          </Button>
          <Button variant="quiet" onClick={() => setDraft(null)} disabled={update.isPending}>
            Undo
          </Button>
        </div>
      ) : null}
      {update.isSuccess && !changed ? <RowMessage tone="success">Roles saved.</RowMessage> : null}
      {problem ? <RowMessage tone="error">{problem}</RowMessage> : null}
      {update.isError ? <RowMessage tone="error">{update.error.fields.roles ?? update.error.message}</RowMessage> : null}
    </fieldset>
  );
}
