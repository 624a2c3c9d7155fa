import type { Role, UnitSystem } from '../schemas/members.ts';

/** What the signed-in member may do; the web app shows and hides by these, never by roles. */
export interface UserAbilities {
  listBundles: boolean;
  buy: boolean;
  claimStarter: boolean;
  reviewBundles: boolean;
  runStarterProgramme: boolean;
  viewLedger: boolean;
  manageMembers: boolean;
  manageSettings: boolean;
}

export interface SessionUser {
  id: string;
  name: string;
  email: string;
  roles: Role[];
  newQuilter: boolean;
  emailVerified: boolean;
  units: UnitSystem;
  abilities: UserAbilities;
}

export interface GuildSummary {
  name: string;
  town: string;
  currency: string;
  defaultUnits: UnitSystem;
  /** The IANA zone the guild keeps its meetings and deadlines in (the e-mails' zone); every screen shows times in it. */
  timeZone: string;
  /** Two-letter codes of the countries the guild's postage table has rates for; empty when it quotes any address. */
  postageCountries: string[];
}

export interface SessionResponse {
  user: SessionUser | null;
  guild: GuildSummary;
  csrfToken: string;
}

export interface MemberRow {
  id: string;
  name: string;
  email: string;
  roles: Role[];
  newQuilter: boolean;
  newQuilterFlag: boolean;
  emailVerified: boolean;
  active: boolean;
  joinedAt: string;
  abilities: { changeRoles: boolean; deactivate: boolean; flagNewQuilter: boolean };
}
