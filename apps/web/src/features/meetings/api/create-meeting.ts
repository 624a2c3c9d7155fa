import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MeetingInput, MeetingView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import { meetingsQueryKey } from '../../../lib/meetings.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';

export const createMeeting = (data: MeetingInput): Promise<{ meeting: MeetingView }> => api.post('/meetings', data);

export function useCreateMeeting(config: MutationConfig<MeetingInput, { meeting: MeetingView }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: createMeeting,
    onSuccess: async (...args) => {
      // Both lists (coming, all) may gain it.
      await queryClient.invalidateQueries({ queryKey: meetingsQueryKey });
      await config.onSuccess?.(...args);
    },
  });
}
