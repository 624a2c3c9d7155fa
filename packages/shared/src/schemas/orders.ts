import { z } from 'zod';
import { isCountryCode } from '../domain/countries.ts';
import { LEDGER_ENTRY_KINDS } from '../domain/money.ts';
import { MAX_LINE_QUANTITY } from '../domain/order-limits.ts';

const text = (label: string, max: number) =>
  z.string({ error: `Enter ${label}.` }).trim().min(1, { error: `Enter ${label}.` }).max(max, { error: `Use at most ${max} characters.` });

export const postalAddressSchema = z.strictObject({
  name: text('the name on the parcel', 100),
  line1: text('the street address', 120),
  line2: z.string().trim().max(120).default(''),
  town: text('the town', 80),
  region: z.string().trim().max(80).default(''),
  postalCode: text('the postal code', 16).regex(/^[A-Za-z0-9 -]+$/, { error: 'Use letters, digits, spaces and hyphens only.' }),
  country: z
    .string({ error: 'Choose the country.' })
    .trim()
    .regex(/^[A-Za-z]{2}$/, { error: 'Use the two-letter country code, like US or CA.' })
    .transform((c) => c.toUpperCase())
    .refine(isCountryCode, { error: 'That is not a country code; choose the country from the list (the United Kingdom is GB).' }),
});
export type PostalAddress = z.infer<typeof postalAddressSchema>;

const lineQuantity = z
  .int({ error: 'Enter a whole number.' })
  .min(1, { error: 'At least 1.' })
  .max(MAX_LINE_QUANTITY, { error: `At most ${MAX_LINE_QUANTITY}.` });

const orderItemSchema = z.strictObject({
  bundleId: z.uuid({ error: 'Not a bundle id.' }),
  quantity: lineQuantity,
});

/** Puts a bundle in the basket: a bundle already there keeps the larger quantity, so adding twice adds nothing. */
export const basketAddSchema = z.strictObject({
  bundleId: z.uuid({ error: 'Not a bundle id.' }),
  quantity: lineQuantity.default(1),
});
export type BasketAddInput = z.input<typeof basketAddSchema>;

export const basketQuantitySchema = z.strictObject({ quantity: lineQuantity });
export type BasketQuantityInput = z.infer<typeof basketQuantitySchema>;

const items = z
  .array(orderItemSchema, { error: 'List the bundles.' })
  .min(1, { error: 'Choose at least one bundle.' })
  .max(20, { error: 'At most 20 bundles in one order.' })
  .refine((list) => new Set(list.map((i) => i.bundleId)).size === list.length, { error: 'List each bundle once.' });

export const postageQuoteRequestSchema = z.strictObject({
  items,
  destination: z.strictObject({
    country: postalAddressSchema.shape.country,
    postalCode: postalAddressSchema.shape.postalCode,
  }),
});
export type PostageQuoteRequest = z.infer<typeof postageQuoteRequestSchema>;

export const orderCreateSchema = z
  .strictObject({
    items,
    fulfilment: z.enum(['post', 'meeting'], { error: 'Choose post or meeting.' }),
    address: postalAddressSchema.optional(),
    meetingId: z.uuid({ error: 'Choose a meeting.' }).optional(),
    saveAddress: z.boolean().optional(),
  })
  .superRefine((v, ctx) => {
    if (v.fulfilment === 'post' && !v.address) ctx.addIssue({ code: 'custom', path: ['address'], message: 'Enter the address to post to.' });
    if (v.fulfilment === 'meeting' && !v.meetingId) ctx.addIssue({ code: 'custom', path: ['meetingId'], message: 'Choose the meeting.' });
    if (v.fulfilment === 'meeting' && v.address) ctx.addIssue({ code: 'custom', path: ['address'], message: 'A meeting handover needs no address.' });
  });
export type OrderCreateInput = z.infer<typeof orderCreateSchema>;

export const orderPostedSchema = z.strictObject({
  trackingNumber: z.string().trim().max(60, { error: 'Use at most 60 characters.' }).optional(),
});

export const orderCancelSchema = z.strictObject({
  reason: z.string().trim().max(500, { error: 'Use at most 500 characters.' }).optional(),
});

export const orderProblemSchema = z.strictObject({
  message: text('what went wrong', 2_000),
});

export const payoutSchema = z.strictObject({
  sellerId: z.uuid({ error: 'Choose the seller.' }),
  amountMinor: z.int({ error: 'Enter the amount in whole cents.' }).min(1, { error: 'More than 0.' }).max(10_000_000),
  method: z.enum(['bank_transfer', 'cheque', 'cash', 'other'], { error: 'Choose how it was paid.' }),
  reference: z.string().trim().max(100, { error: 'Use at most 100 characters.' }).default(''),
});
export type PayoutInput = z.infer<typeof payoutSchema>;

export const ledgerQuerySchema = z.strictObject({
  from: z.iso.date({ error: 'Use a date like 2026-11-30.' }).optional(),
  to: z.iso.date({ error: 'Use a date like 2026-11-30.' }).optional(),
  kind: z.enum(LEDGER_ENTRY_KINDS, { error: 'Unknown entry kind.' }).optional(),
});
export type LedgerQuery = z.infer<typeof ledgerQuerySchema>;

export const meetingSchema = z.strictObject({
  startsAt: z.iso.datetime({ offset: true, error: 'Use a date and time like 2026-12-10T19:00:00Z.' }),
  place: text('the place', 120),
  notes: z.string().trim().max(1_000).default(''),
});
export type MeetingInput = z.infer<typeof meetingSchema>;
export const meetingUpdateSchema = meetingSchema.partial();

const wholeMm = z.int({ error: 'Whole millimetres.' }).min(1).max(2_000);
export const postageTableSchema = z
  .strictObject({
    countries: z
      .array(postalAddressSchema.shape.country, { error: 'List two-letter country codes, like US.' })
      .max(50, { error: 'At most 50 countries.' })
      .refine((list) => new Set(list).size === list.length, { error: 'List each country once.' })
      .default([]),
    dimensional: z.strictObject({
      divisorCubicInchesPerPound: z.number().positive({ error: 'Must be more than 0.' }).max(1_000),
      thresholdCubicInches: z.number().min(0).max(100_000),
      roundEachDimensionUp: z.boolean(),
    }),
    zones: z
      .array(
        z.strictObject({
          code: z.string().trim().regex(/^[a-z0-9_-]{1,30}$/, { error: 'Lower-case letters, digits, - and _.' }),
          postalPrefixes: z.array(z.string().trim().min(1).max(16)).min(1, { error: 'At least one prefix, or * for all.' }).max(500),
        }),
      )
      .min(1, { error: 'At least one zone.' })
      .max(50),
    bands: z
      .array(
        z.strictObject({
          zone: z.string().trim().min(1),
          maxGrams: z.int({ error: 'Whole grams.' }).min(1).max(100_000),
          priceMinor: z.int({ error: 'Whole cents.' }).min(0).max(100_000),
        }),
      )
      .min(1, { error: 'At least one weight band.' })
      .max(500),
    packaging: z
      .array(
        z.strictObject({
          code: z.string().trim().regex(/^[a-z0-9_-]{1,30}$/, { error: 'Lower-case letters, digits, - and _.' }),
          name: z.string().trim().min(1).max(60),
          innerMm: z.tuple([wholeMm, wholeMm, wholeMm]),
          tareGrams: z.int({ error: 'Whole grams.' }).min(0).max(5_000),
          maxGrams: z.int({ error: 'Whole grams.' }).min(1).max(100_000),
          flatPriceMinor: z.int({ error: 'Whole cents.' }).min(0).max(100_000).nullable(),
        }),
      )
      .min(1, { error: 'At least one package.' })
      .max(20),
    handlingMinor: z.int({ error: 'Whole cents.' }).min(0).max(10_000),
  })
  .superRefine((t, ctx) => {
    const zones = new Set(t.zones.map((z) => z.code));
    t.bands.forEach((b, i) => {
      if (!zones.has(b.zone)) ctx.addIssue({ code: 'custom', path: ['bands', i, 'zone'], message: `No zone called "${b.zone}".` });
    });
    t.packaging.forEach((p, i) => {
      if (p.tareGrams >= p.maxGrams) ctx.addIssue({ code: 'custom', path: ['packaging', i, 'tareGrams'], message: 'The package weighs more than it may hold.' });
    });
    if (new Set(t.zones.map((z) => z.code)).size !== t.zones.length) ctx.addIssue({ code: 'custom', path: ['zones'], message: 'Zone codes must differ.' });
  });
export type PostageTableInput = z.infer<typeof postageTableSchema>;
