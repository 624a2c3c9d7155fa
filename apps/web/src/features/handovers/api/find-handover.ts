import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';

/** Which meeting's sheet holds a handover (the check-off page a QR code opens). */
export const findHandoverMeetingId = async (handoverId: string): Promise<string> =>
  (await api.get<{ meetingId: string }>(`/handovers/${encodeURIComponent(handoverId)}`)).meetingId;

export const findHandoverQueryOptions = (handoverId: string) =>
  queryOptions({ queryKey: ['handover-meeting', handoverId], queryFn: () => findHandoverMeetingId(handoverId), staleTime: Infinity });

export const useHandoverMeetingId = (handoverId: string) => useQuery(findHandoverQueryOptions(handoverId));
