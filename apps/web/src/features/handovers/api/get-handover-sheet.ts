import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { HandoverSheet } from '../types.ts';

export const handoverSheetsQueryKey = ['handover-sheets'] as const;
export const handoverSheetQueryKey = (meetingId: string) => [...handoverSheetsQueryKey, meetingId] as const;

/** Everything due at one meeting, sorted by who brings it, each with its QR code. */
export const getHandoverSheet = (meetingId: string, { signal }: { signal?: AbortSignal } = {}): Promise<HandoverSheet> =>
  api.get(`/meetings/${encodeURIComponent(meetingId)}/handovers`, { signal });

export const getHandoverSheetQueryOptions = (meetingId: string) =>
  queryOptions({
    queryKey: handoverSheetQueryKey(meetingId),
    queryFn: ({ signal }) => getHandoverSheet(meetingId, { signal }),
    // At the door two librarians may tick on two phones: keep each other's ticks showing.
    refetchInterval: 30_000,
  });

export const useHandoverSheet = (meetingId: string | undefined) =>
  useQuery({ ...getHandoverSheetQueryOptions(meetingId ?? ''), enabled: Boolean(meetingId) });
