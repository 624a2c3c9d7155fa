import type { Actor } from './index.ts';

const isAdmin = (a: Actor) => a.roles.includes('admin');
const isLibrarian = (a: Actor) => a.roles.includes('librarian');

export const memberPolicy = {
  /** Librarians see the member list too, to set the new-quilter flag. */
  'member.list': (a: Actor) => isAdmin(a) || isLibrarian(a),
  'member.changeRoles': (a: Actor, target?: { id: string }) => isAdmin(a) && target !== undefined,
  /** An admin cannot switch off their own account (and so lock the guild out). */
  'member.deactivate': (a: Actor, target?: { id: string }) => isAdmin(a) && target !== undefined && target.id !== a.id,
  'member.flagNewQuilter': (a: Actor, _target?: { id: string }) => isAdmin(a) || isLibrarian(a),
};
