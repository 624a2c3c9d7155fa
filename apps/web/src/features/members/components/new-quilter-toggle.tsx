import type { MemberRow } from '@scrap-relay/shared';
import { Checkbox } from '../../../components/ui/field.tsx';
import { useUpdateMember } from '../api/update-member.ts';
import { RowMessage } from './row-message.tsx';

function standing(member: MemberRow): string {
  if (!member.newQuilter) return 'Not counted as a new quilter.';
  return member.newQuilterFlag ? 'Counts as a new quilter (flagged).' : 'Counts as a new quilter (joined recently).';
}

/** The librarian's or admin's "new quilter" flag, on top of the guild's newcomer window. */
export function NewQuilterToggle({ member }: { member: MemberRow }) {
  const update = useUpdateMember();
  if (!member.abilities.flagNewQuilter) return <p>{standing(member)}</p>;
  // Show the box as asked while the save runs; it falls back to the saved value if the save fails.
  const requested = update.isPending ? update.variables.data.newQuilterFlag : undefined;
  return (
    <div className="space-y-1">
      <Checkbox
        label={
          <>
            Flag as new quilter<span className="sr-only"> ({member.name})</span>
          </>
        }
        hint={standing(member)}
        checked={requested ?? member.newQuilterFlag}
        disabled={update.isPending}
        onChange={(event) => update.mutate({ memberId: member.id, data: { newQuilterFlag: event.target.checked } })}
      />
      {update.isError ? <RowMessage tone="error">{update.error.message}</RowMessage> : null}
    </div>
  );
}
