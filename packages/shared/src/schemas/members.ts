import { z } from 'zod';
// In the domain, not here: a page that only lists roles then loads no zod schema.
import { ROLES } from '../domain/roles.ts';

export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const UNIT_SYSTEMS = ['imperial', 'metric'] as const;
export const unitSystemSchema = z.enum(UNIT_SYSTEMS);
export type UnitSystem = z.infer<typeof unitSystemSchema>;

export const PASSWORD_MIN_LENGTH = 10;

const email = z.email({ error: 'Enter a valid e-mail address.' }).max(254).transform((s) => s.trim().toLowerCase());
const password = z
  .string({ error: 'Enter a password.' })
  .min(PASSWORD_MIN_LENGTH, { error: `Use at least ${PASSWORD_MIN_LENGTH} characters.` })
  .max(200, { error: 'Use at most 200 characters.' });
const personName = z.string({ error: 'Enter your name.' }).trim().min(1, { error: 'Enter your name.' }).max(80);

export const signInSchema = z.strictObject({
  email,
  password: z.string({ error: 'Enter your password.' }).min(1, { error: 'Enter your password.' }).max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const joinSchema = z.strictObject({
  inviteCode: z.string({ error: 'Enter the guild invite code.' }).trim().min(4, { error: 'Enter the guild invite code.' }).max(40),
  name: personName,
  email,
  password,
});
export type JoinInput = z.infer<typeof joinSchema>;

export const tokenSchema = z.strictObject({
  token: z.string({ error: 'The link is missing its token.' }).min(16).max(200),
});

export const passwordResetRequestSchema = z.strictObject({ email });

export const passwordResetCompleteSchema = z.strictObject({
  token: z.string({ error: 'The link is missing its token.' }).min(16).max(200),
  password,
});

export const memberUpdateSchema = z
  .strictObject({
    roles: z.array(roleSchema).max(4).refine((r) => r.includes('member'), { error: 'Every account keeps the member role.' }).optional(),
    active: z.boolean().optional(),
    newQuilterFlag: z.boolean().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { error: 'Nothing to change.' });
export type MemberUpdateInput = z.infer<typeof memberUpdateSchema>;

export const CURRENCIES = ['USD', 'CAD', 'GBP', 'EUR', 'AUD', 'NZD', 'JPY'] as const;
export const currencySchema = z.enum(CURRENCIES);

/** IANA time zones this runtime knows (Node and every current browser list them), plus UTC. */
export const isKnownTimeZone = (zone: string): boolean => zone === 'UTC' || Intl.supportedValuesOf('timeZone').includes(zone);

export const guildSettingsSchema = z.strictObject({
  name: z.string().trim().min(2, { error: 'Enter the guild name.' }).max(100),
  town: z.string().trim().max(100),
  currency: currencySchema,
  defaultUnits: unitSystemSchema,
  newcomerWindowMonths: z.int({ error: 'Enter a whole number of months.' }).min(0, { error: 'At least 0 months.' }).max(60, { error: 'At most 60 months.' }),
  shelfLimitDays: z.int({ error: 'Enter a whole number of days.' }).min(7, { error: 'At least 7 days.' }).max(365, { error: 'At most 365 days.' }),
  holdMinutes: z.int({ error: 'Enter a whole number of minutes.' }).min(5, { error: 'At least 5 minutes.' }).max(240, { error: 'At most 240 minutes.' }),
  guildFeeBasisPoints: z.int().min(0).max(5000),
  processingPercentBasisPoints: z.int().min(0).max(2000),
  processingFixedMinor: z.int().min(0).max(10_000),
  starterLimitPerWindow: z.int().min(1).max(10),
  starterWindowDays: z.int().min(1).max(730),
  starterOfferHours: z.int().min(1).max(720),
  starterPostingAllowed: z.boolean(),
  /** Where the guild meets: e-mails give meeting times and deadlines in this zone. */
  timeZone: z.string({ error: 'Choose a time zone.' }).refine(isKnownTimeZone, { error: 'Choose a time zone from the list.' }).default('UTC'),
});
export type GuildSettings = z.infer<typeof guildSettingsSchema>;
