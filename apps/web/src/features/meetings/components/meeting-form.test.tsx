// @vitest-environment happy-dom
import type { MeetingInput, MeetingView } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { afterEach, describe, expect, it } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { makeSession, makeUser, testGuild } from '../../../testing/fixtures.ts';
import { buttonNamed, byLabel, cleanup, click, render, typeInto, waitFor } from '../../../testing/render.tsx';
import { SESSION_CACHE_KEY } from '../../../utils/guild-session.ts';
import { MeetingForm } from './meeting-form.tsx';

afterEach(() => cleanup());

/** The meeting form in a guild whose time zone is America/Los_Angeles, whatever zone the device running the test is in. */
async function meetingForm(meeting?: MeetingView) {
  const client = createQueryClient();
  client.setQueryData(SESSION_CACHE_KEY, { ...makeSession(makeUser()), guild: { ...testGuild, timeZone: 'America/Los_Angeles' } });
  const sent: MeetingInput[] = [];
  const rendered = await render(
    <QueryClientProvider client={client}>
      <MeetingForm meeting={meeting} submitLabel="Save" onSubmit={async (values) => void sent.push(values)} />
    </QueryClientProvider>,
  );
  return { ...rendered, sent };
}

describe('the meeting form', () => {
  it('says the time is the guild’s, by the zone’s name', async () => {
    const { container } = await meetingForm();
    expect(container.textContent).toContain('In the guild’s time zone: Pacific Time (America/Los Angeles).');
    expect(container.textContent).not.toContain('your time zone');
  });

  it('sends a typed December evening with the Pacific winter offset (UTC−8, IANA tz database)', async () => {
    const { container, sent } = await meetingForm();
    await typeInto(byLabel(container, 'Date and start time'), '2026-12-11T19:00');
    await typeInto(byLabel(container, 'Place'), 'Ferncombe Village Hall');
    await click(buttonNamed(container, 'Save'));
    await waitFor(() => expect(sent).toHaveLength(1));
    expect(sent[0]?.startsAt).toBe('2026-12-11T19:00:00-08:00');
  });

  it('shows a meeting being edited at the guild’s wall-clock time', async () => {
    const meeting: MeetingView = { id: 'm-1', startsAt: '2026-12-12T03:00:00.000Z', place: 'Ferncombe Village Hall', notes: '', abilities: { edit: true } };
    const { container } = await meetingForm(meeting);
    expect(byLabel(container, 'Date and start time').value).toBe('2026-12-11T19:00');
  });
});
