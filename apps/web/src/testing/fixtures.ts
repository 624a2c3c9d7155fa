import type { BundleCard, BundleView, GuildSummary, MemberRow, SessionResponse, SessionUser, UserAbilities } from '@scrap-relay/shared';
import { estimateYield } from '@scrap-relay/shared';

/** Invented people and an invented guild for unit tests; each test states what differs from these. */

export const NO_ABILITIES: UserAbilities = {
  listBundles: false,
  buy: false,
  claimStarter: false,
  reviewBundles: false,
  runStarterProgramme: false,
  viewLedger: false,
  manageMembers: false,
  manageSettings: false,
};

export const MEMBER_ABILITIES: UserAbilities = { ...NO_ABILITIES, listBundles: true, buy: true };

export const ADMIN_ABILITIES: UserAbilities = { ...MEMBER_ABILITIES, manageMembers: true, manageSettings: true };

export const testGuild: GuildSummary = {
  name: 'Larkhollow Quilting Circle',
  town: 'Larkhollow',
  currency: 'GBP',
  defaultUnits: 'metric',
  timeZone: 'Europe/London',
  postageCountries: ['GB'],
};

export function makeUser(overrides: Partial<SessionUser> = {}): SessionUser {
  return {
    id: 'u-1',
    name: 'Hester Quill',
    email: 'hester@larkhollow.example',
    roles: ['member'],
    newQuilter: false,
    emailVerified: true,
    units: 'metric',
    abilities: MEMBER_ABILITIES,
    ...overrides,
  };
}

export function makeSession(user: SessionUser | null, csrfToken = 'csrf-1'): SessionResponse {
  return { user, guild: testGuild, csrfToken };
}

export function makeMember(index: number, overrides: Partial<MemberRow> = {}): MemberRow {
  return {
    id: `m-${index}`,
    name: `Member ${String(index).padStart(2, '0')}`,
    email: `member${index}@larkhollow.example`,
    roles: ['member'],
    newQuilter: false,
    newQuilterFlag: false,
    emailVerified: true,
    active: true,
    joinedAt: new Date(Date.UTC(2024, 0, index)).toISOString(),
    abilities: { changeRoles: true, deactivate: true, flagNewQuilter: true },
    ...overrides,
  };
}

export const jsonResponse = (status: number, body?: unknown): Response =>
  new Response(body === undefined ? null : JSON.stringify(body), {
    status,
    headers: body === undefined ? {} : { 'Content-Type': 'application/json' },
  });

/** A sale bundle as a shelf card (one item of GET /api/bundles), with a thumbnail and its medium size. */
export function makeBundleCard(overrides: Partial<BundleCard> = {}): BundleCard {
  return {
    id: 'b-1',
    title: 'Indigo batik strips',
    offer: 'sale',
    priceMinor: 1200,
    currency: 'USD',
    meetingHandoverOk: false,
    quantityAvailable: 1,
    weightGrams: 454,
    fibre: 'batik',
    cutKinds: ['strips'],
    colour: { value: 'dark', family: 'cool' },
    thumbUrl: '/uploads/photos/b-1-400.webp',
    thumb2xUrl: '/uploads/photos/b-1-800.webp',
    yield: estimateYield({ grams: 454, fibre: 'batik' }),
    onShelfAt: '2026-03-01T10:00:00.000Z',
    ...overrides,
  };
}

/** A sale bundle on the shelf, as GET /api/bundles/:id presents it to a member who may buy it. */
export function makeBundleView(overrides: Partial<BundleView> = {}): BundleView {
  return {
    id: 'bundle-1',
    title: 'Bundle 1',
    description: '',
    state: 'on_shelf',
    offer: 'sale',
    priceMinor: 800,
    currency: 'USD',
    meetingHandoverOk: false,
    quantity: 1,
    quantityAvailable: 1,
    weightGrams: 450,
    fibre: 'quilting_cotton',
    cutKinds: ['strips'],
    cutSizes: ['strip_2_5'],
    colour: { value: 'medium', family: 'cool', suggested: null },
    prewashed: true,
    disclosures: { smokeFree: true, petFree: true },
    pieces: [],
    photos: [],
    yield: null,
    cutPlan: null,
    seller: { id: 'seller-orla', firstName: 'Orla', rehomedCount: 3, returnedCount: 0 },
    reviewNotes: null,
    submittedAt: null,
    onShelfAt: null,
    expiresAt: null,
    createdAt: '2026-11-01T10:00:00.000Z',
    updatedAt: '2026-11-01T10:00:00.000Z',
    abilities: { edit: false, submit: false, withdraw: false, relist: false, review: false, buy: true, claim: false },
    ...overrides,
  };
}
