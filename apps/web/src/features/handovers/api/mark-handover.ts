import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, type ApiError } from '../../../lib/api-client.ts';
import type { HandoverView } from '@scrap-relay/shared';
import type { HandoverSheet } from '../types.ts';
import { handoverSheetQueryKey } from './get-handover-sheet.ts';

export interface MarkHandoverVariables {
  handoverId: string;
  /** true ticks it, false takes the tick back. */
  done: boolean;
}

export const markHandover = ({ handoverId, done }: MarkHandoverVariables): Promise<void> =>
  done ? api.post(`/handovers/${encodeURIComponent(handoverId)}/done`) : api.delete(`/handovers/${encodeURIComponent(handoverId)}/done`);

/** How a row looks straight after the tap, before the API's answer arrives. */
export function markedLocally(handover: HandoverView, done: boolean, viewerName: string, now: Date): HandoverView {
  return done
    ? { ...handover, done: true, doneAt: now.toISOString(), doneBy: viewerName, abilities: { markDone: false, undo: true, cancel: false }, undoNote: null }
    : { ...handover, done: false, doneAt: null, doneBy: null, abilities: { markDone: true, undo: false, cancel: true }, undoNote: null };
}

/**
 * Tick or untick at the door. The row changes at once (a queue is waiting) and is
 * put back if the API refuses; the sheet is then read again for the recorded name and time.
 */
export function useMarkHandover(meetingId: string, viewerName: string) {
  const queryClient = useQueryClient();
  const key = handoverSheetQueryKey(meetingId);
  return useMutation<void, ApiError, MarkHandoverVariables, { previous: HandoverSheet | undefined }>({
    mutationFn: markHandover,
    onMutate: async ({ handoverId, done }) => {
      await queryClient.cancelQueries({ queryKey: key });
      const previous = queryClient.getQueryData<HandoverSheet>(key);
      queryClient.setQueryData<HandoverSheet>(key, (sheet) =>
        sheet ? { ...sheet, items: sheet.items.map((h) => (h.id === handoverId ? markedLocally(h, done, viewerName, new Date()) : h)) } : sheet,
      );
      return { previous };
    },
    onError: (_error, _variables, context) => {
      if (context?.previous) queryClient.setQueryData(key, context.previous);
    },
    onSettled: async () => {
      await queryClient.invalidateQueries({ queryKey: key });
    },
  });
}
