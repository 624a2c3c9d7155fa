import { describe, expect, it } from 'vitest';
import { meetingFormSchema } from './meeting-form-schema.ts';

describe('meeting form → the API’s meeting input', () => {
  it('turns the typed local date and time into an ISO instant with the browser’s offset', () => {
    const parsed = meetingFormSchema.parse({ startsAt: '2026-12-10T19:00', place: '  Ferncombe Village Hall ', notes: '' });
    expect(new Date(parsed.startsAt).getTime()).toBe(new Date(2026, 11, 10, 19, 0).getTime());
    expect(parsed.startsAt).toMatch(/^2026-12-10T19:00:00[+-]\d{2}:\d{2}$/);
    expect(parsed.place).toBe('Ferncombe Village Hall');
  });

  it('asks for a date and time when the input is empty or incomplete', () => {
    const result = meetingFormSchema.safeParse({ startsAt: '', place: 'Hall', notes: '' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]).toMatchObject({ path: ['startsAt'], message: 'Choose the date and the time the meeting starts.' });
  });

  it('keeps the API’s own rules for the other fields', () => {
    const result = meetingFormSchema.safeParse({ startsAt: '2026-12-10T19:00', place: ' ', notes: '' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.path).toEqual(['place']);
  });
});
