/** The librarian's report, as apps/api/src/modules/office/reports.service.ts presents it (not yet in the shared contracts). */
export interface LibrarianReport {
  review: { approved: number; returned: number; commonReturnNotes: { notes: string; times: number }[] };
  starter: { claims: number; waitingNow: number; medianWaitDays: number | null };
  handovers: { meetingId: string; startsAt: string; place: string; done: number; missed: number; due: number }[];
}
