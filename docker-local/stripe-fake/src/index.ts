export { createStripeFake, type StripeFake, type StripeFakeOptions } from './server.ts';
export { readConfig, ConfigError, type StripeFakeConfig } from './config.ts';
export { signatureHeader } from './webhooks.ts';
export { TEST_CARDS } from './checkout.ts';
export type { FakeStore, SessionRecord } from './store.ts';
export type * from './types.ts';
