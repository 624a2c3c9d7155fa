import { describe, expect, it } from 'vitest';
import { meetingFormSchemaFor } from './meeting-form-schema.ts';

// America/Los_Angeles is UTC−8 in December and UTC−7 in July (IANA tz database).
const guildSchema = meetingFormSchemaFor('America/Los_Angeles');

describe('meeting form → the API’s meeting input', () => {
  it('reads the typed date and time in the guild’s zone and sends that zone’s offset', () => {
    const parsed = guildSchema.parse({ startsAt: '2026-12-11T19:00', place: '  Ferncombe Village Hall ', notes: '' });
    expect(parsed.startsAt).toBe('2026-12-11T19:00:00-08:00');
    expect(new Date(parsed.startsAt).toISOString()).toBe('2026-12-12T03:00:00.000Z');
    expect(parsed.place).toBe('Ferncombe Village Hall');
  });

  it('uses the summer offset for a summer meeting', () => {
    expect(guildSchema.parse({ startsAt: '2026-07-11T19:00', place: 'Hall', notes: '' }).startsAt).toBe('2026-07-11T19:00:00-07:00');
  });

  it('asks for a date and time when the input is empty or incomplete', () => {
    const result = guildSchema.safeParse({ startsAt: '', place: 'Hall', notes: '' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]).toMatchObject({ path: ['startsAt'], message: 'Choose the date and the time the meeting starts.' });
  });

  it('says so when the clocks skip the typed time', () => {
    // US summer time starts at 02:00 on 8 March 2026: 02:30 never happens in Los Angeles.
    const result = guildSchema.safeParse({ startsAt: '2026-03-08T02:30', place: 'Hall', notes: '' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.message).toBe(
      'On that day the clocks in Pacific Time (America/Los Angeles) jump forward past this time, so it never happens there: choose another time.',
    );
  });

  it('keeps the API’s own rules for the other fields', () => {
    const result = guildSchema.safeParse({ startsAt: '2026-12-10T19:00', place: ' ', notes: '' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.path).toEqual(['place']);
  });
});
