import { z } from 'zod';
import { unitSystemSchema } from './members.ts';

/**
 * Kinds of e-mail a member may turn off. Messages about money (sold, paid, refunds) and
 * account security (verification, password reset) are always sent and are not listed.
 */
export const OPTIONAL_EMAIL_KINDS = ['review', 'wishes', 'starter', 'meetings', 'posting'] as const;
export type OptionalEmailKind = (typeof OPTIONAL_EMAIL_KINDS)[number];
export const EMAIL_KIND_LABELS: Record<OptionalEmailKind, string> = {
  review: 'The librarian approved or returned my listing',
  wishes: 'A new bundle matches one of my wishes',
  starter: 'A reminder before a starter-bundle offer runs out',
  meetings: 'Reminders before a meeting where I hand over or collect',
  posting: 'My parcel was posted or arrived',
};

export const profileUpdateSchema = z
  .strictObject({
    name: z.string().trim().min(1, { error: 'Enter your name.' }).max(80, { error: 'Use at most 80 characters.' }).optional(),
    units: unitSystemSchema.optional(),
    emailPreferences: z.partialRecord(z.enum(OPTIONAL_EMAIL_KINDS, { error: 'Unknown kind of e-mail.' }), z.boolean()).optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { error: 'Nothing to change.' });
export type ProfileUpdateInput = z.infer<typeof profileUpdateSchema>;

export const closeAccountSchema = z.strictObject({
  password: z.string({ error: 'Enter your password to confirm.' }).min(1, { error: 'Enter your password to confirm.' }).max(200),
});

export const dashboardQuerySchema = z
  .strictObject({
    period: z.enum(['month', 'year', 'all', 'custom'], { error: 'Use month, year, all or custom.' }).default('month'),
    from: z.iso.date({ error: 'Use a date like 2026-11-01.' }).optional(),
    to: z.iso.date({ error: 'Use a date like 2026-11-30.' }).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.period === 'custom' && (!v.from || !v.to)) ctx.addIssue({ code: 'custom', path: [v.from ? 'to' : 'from'], message: 'A custom period needs both dates.' });
    if (v.from && v.to && v.from > v.to) ctx.addIssue({ code: 'custom', path: ['to'], message: 'The end comes before the start.' });
  });
export type DashboardQuery = z.infer<typeof dashboardQuerySchema>;

export const statementQuerySchema = z.strictObject({
  month: z.string({ error: 'Choose a month.' }).regex(/^\d{4}-(0[1-9]|1[0-2])$/, { error: 'Use a month like 2026-11.' }),
});
