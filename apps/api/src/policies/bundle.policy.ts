import type { BundleState } from '@scrap-relay/shared';
import type { Actor } from './index.ts';

type BundleRecord = { sellerId: string; state: BundleState; quantityAvailable?: number; offer?: string | null };

const EDITABLE: BundleState[] = ['draft', 'returned', 'withdrawn', 'expired'];
const SUBMITTABLE: BundleState[] = ['draft', 'returned', 'withdrawn', 'expired'];
const WITHDRAWABLE: BundleState[] = ['draft', 'in_review', 'on_shelf', 'returned', 'expired'];
const PUBLIC: BundleState[] = ['on_shelf', 'held', 'rehomed'];

const isSeller = (a: Actor, b?: BundleRecord) => b !== undefined && b.sellerId === a.id;
const isLibrarian = (a: Actor) => a.roles.includes('librarian');
const verified = (a: Actor) => a.emailVerifiedAt != null;

export const bundlePolicy = {
  'bundle.create': (a: Actor, _b?: undefined) => verified(a),
  'bundle.view': (a: Actor, b?: BundleRecord) =>
    b !== undefined && (isSeller(a, b) || PUBLIC.includes(b.state) || (isLibrarian(a) && b.state === 'in_review')),
  'bundle.edit': (a: Actor, b?: BundleRecord) => isSeller(a, b) && verified(a) && EDITABLE.includes(b!.state),
  'bundle.submit': (a: Actor, b?: BundleRecord) => isSeller(a, b) && verified(a) && SUBMITTABLE.includes(b!.state),
  'bundle.withdraw': (a: Actor, b?: BundleRecord) => isSeller(a, b) && WITHDRAWABLE.includes(b!.state),
  'bundle.relist': (a: Actor, b?: BundleRecord) => isSeller(a, b) && verified(a) && (b!.state === 'expired' || b!.state === 'withdrawn'),
  'bundle.reviewQueue': (a: Actor, _b?: undefined) => isLibrarian(a),
  /** A librarian never reviews their own bundle (another librarian does), except a starter bundle made up from the guild's stash. */
  'bundle.review': (a: Actor, b?: BundleRecord) =>
    isLibrarian(a) && b !== undefined && (!isSeller(a, b) || b.offer === 'starter') && b.state === 'in_review',
  'bundle.buy': (a: Actor, b?: BundleRecord) =>
    verified(a) && b !== undefined && b.offer !== 'starter' && !isSeller(a, b) && b.state === 'on_shelf' && (b.quantityAvailable ?? 0) > 0,
  'bundle.claim': (a: Actor, b?: BundleRecord) =>
    verified(a) && a.newQuilter === true && b !== undefined && b.offer === 'starter' && !isSeller(a, b) && b.state === 'on_shelf' && (b.quantityAvailable ?? 0) > 0,
  /** Librarians keep the waiting list; they may also approve the guild's own starter bundles they made up. */
  'starter.manage': (a: Actor, _b?: undefined) => isLibrarian(a),
};
