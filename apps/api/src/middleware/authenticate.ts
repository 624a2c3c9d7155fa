import type { Request } from 'express';
import type { Member } from '../db/models/index.ts';
import { emailNotVerified, unauthenticated } from '../errors/index.ts';

/** The signed-in member, or a 401. */
export function requireMember(req: Request): Member {
  if (!req.user) throw unauthenticated();
  return req.user as Member;
}

/** The signed-in member with a confirmed e-mail address (needed to list, buy or claim). */
export function requireVerifiedMember(req: Request): Member {
  const member = requireMember(req);
  if (!member.emailVerifiedAt) throw emailNotVerified();
  return member;
}
