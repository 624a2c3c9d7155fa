import type { UserAbilities } from '@scrap-relay/shared';
import type { Member } from '../db/models/index.ts';
import { forbidden } from '../errors/index.ts';
import { memberPolicy } from './member.policy.ts';
import { guildPolicy } from './guild.policy.ts';
import { bundlePolicy } from './bundle.policy.ts';
import { orderPolicy } from './order.policy.ts';

export type Actor = Pick<Member, 'id' | 'roles' | 'active' | 'emailVerifiedAt'> & { newQuilter?: boolean };

const policies = { ...memberPolicy, ...guildPolicy, ...bundlePolicy, ...orderPolicy };
export type Action = keyof typeof policies;
type RecordOf<A extends Action> = Parameters<(typeof policies)[A]>[1];

export const can = <A extends Action>(actor: Actor, action: A, record?: RecordOf<A>): boolean =>
  actor.active && (policies[action] as (a: Actor, r?: unknown) => boolean)(actor, record);

/** The single gate every route passes through: throws 403 when the actor may not. */
export function authorize<A extends Action>(actor: Actor, action: A, record?: RecordOf<A>): void {
  if (!can(actor, action, record)) throw forbidden();
}

export const hasRole = (actor: Pick<Actor, 'roles'>, role: string) => actor.roles.includes(role as never);

export function abilitiesFor(actor: Actor & { newQuilter: boolean }): UserAbilities {
  const verified = Boolean(actor.emailVerifiedAt) && actor.active;
  return {
    listBundles: can(actor, 'bundle.create'),
    buy: verified,
    claimStarter: verified && actor.newQuilter,
    reviewBundles: can(actor, 'bundle.reviewQueue'),
    runStarterProgramme: actor.active && hasRole(actor, 'librarian'),
    viewLedger: can(actor, 'ledger.view'),
    manageMembers: can(actor, 'member.list'),
    manageSettings: can(actor, 'guild.manageSettings'),
  };
}
