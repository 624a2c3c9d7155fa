import type { OptionalEmailKind, PostalAddress, UnitSystem } from '@scrap-relay/shared';

/** The member's own profile as GET/PATCH /api/me present it (apps/api/src/modules/members/profile.service.ts). */
export interface Profile {
  id: string;
  name: string;
  email: string;
  /** Null until the member chooses: they then read the guild's default units. */
  units: UnitSystem | null;
  /** Kinds switched off are false; a kind never chosen is sent. */
  emailPreferences: Partial<Record<OptionalEmailKind, boolean>>;
  postalAddress: PostalAddress | null;
  joinedAt: string;
}
