import type { HandoverView, MeetingView } from '@scrap-relay/shared';

/** A meeting's handover sheet as GET /api/meetings/:id/handovers answers it. */
export interface HandoverSheet {
  meeting: MeetingView;
  items: HandoverView[];
}
