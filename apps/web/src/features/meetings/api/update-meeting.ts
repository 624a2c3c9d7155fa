import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { MeetingView, meetingUpdateSchema } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import { meetingsQueryKey } from '../../../lib/meetings.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';

export interface UpdateMeetingVariables {
  meetingId: string;
  data: z.output<typeof meetingUpdateSchema>;
}

export const updateMeeting = ({ meetingId, data }: UpdateMeetingVariables): Promise<{ meeting: MeetingView }> =>
  api.patch(`/meetings/${encodeURIComponent(meetingId)}`, data);

export function useUpdateMeeting(config: MutationConfig<UpdateMeetingVariables, { meeting: MeetingView }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: updateMeeting,
    onSuccess: async (...args) => {
      // A new time can move it between the coming and past lists, so read both again.
      await queryClient.invalidateQueries({ queryKey: meetingsQueryKey });
      await config.onSuccess?.(...args);
    },
  });
}
