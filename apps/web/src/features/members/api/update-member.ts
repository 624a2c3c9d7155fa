import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MemberRow, MemberUpdateInput } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { membersQueryKey } from './get-members.ts';

export interface UpdateMemberVariables {
  memberId: string;
  data: MemberUpdateInput;
}

export const updateMember = ({ memberId, data }: UpdateMemberVariables): Promise<{ member: MemberRow }> =>
  api.patch(`/members/${encodeURIComponent(memberId)}`, data);

export function useUpdateMember(config: MutationConfig<UpdateMemberVariables, { member: MemberRow }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: updateMember,
    onSuccess: async (...args) => {
      const [{ member }] = args;
      // The answer is the whole row, abilities included: swap it in rather than reload every member.
      queryClient.setQueryData<{ items: MemberRow[] }>(membersQueryKey, (old) =>
        old ? { items: old.items.map((row) => (row.id === member.id ? member : row)) } : old,
      );
      await config.onSuccess?.(...args);
    },
  });
}
