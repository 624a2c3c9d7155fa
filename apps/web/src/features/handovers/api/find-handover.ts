import { queryOptions, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { MeetingView } from '@scrap-relay/shared';
import { ApiError } from '../../../lib/api-client.ts';
import { getMeetingsQueryOptions } from '../../../lib/meetings.ts';
import { getHandoverSheetQueryOptions } from './get-handover-sheet.ts';

/** Meetings nearest in time first: a QR code is scanned at the door, so tonight's sheet is the likely one. */
export function meetingsByCloseness(meetings: readonly MeetingView[], now: Date): MeetingView[] {
  const distance = (m: MeetingView) => Math.abs(new Date(m.startsAt).getTime() - now.getTime());
  return [...meetings].sort((a, b) => distance(a) - distance(b));
}

const BATCH = 3;

/**
 * Which meeting's sheet holds a handover. The API has no route for one handover by id,
 * so this reads the sheets of the guild's meetings, nearest first, a few at a time
 * (each sheet is cached, so the page showing it afterwards needs no second request).
 */
export async function findHandoverMeetingId(queryClient: QueryClient, handoverId: string, now: Date = new Date()): Promise<string> {
  const { items } = await queryClient.fetchQuery(getMeetingsQueryOptions('all'));
  const ordered = meetingsByCloseness(items, now);
  for (let start = 0; start < ordered.length; start += BATCH) {
    const sheets = await Promise.all(ordered.slice(start, start + BATCH).map((m) => queryClient.fetchQuery(getHandoverSheetQueryOptions(m.id))));
    const sheet = sheets.find((s) => s.items.some((h) => h.id === handoverId));
    if (sheet) return sheet.meeting.id;
  }
  throw new ApiError(404, 'not_found', 'This handover is not on any meeting’s sheet. It may have been cancelled, or the code is from an old sheet.');
}

export const findHandoverQueryOptions = (queryClient: QueryClient, handoverId: string) =>
  queryOptions({ queryKey: ['handover-meeting', handoverId], queryFn: () => findHandoverMeetingId(queryClient, handoverId), staleTime: Infinity });

export function useHandoverMeetingId(handoverId: string) {
  const queryClient = useQueryClient();
  return useQuery(findHandoverQueryOptions(queryClient, handoverId));
}
