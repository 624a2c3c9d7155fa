import type { FakeStore } from './store.ts';
import type { WebhookDispatcher } from './webhooks.ts';

/** What every part of the stand-in shares: its memory, its clock and its outbox. */
export interface FakeContext {
  store: FakeStore;
  webhooks: WebhookDispatcher;
  /** Unix seconds on the stand-in's clock (injectable so tests can move time). */
  clock: () => number;
  /** Base URL payers reach the hosted payment page on. */
  publicUrl: string;
}
