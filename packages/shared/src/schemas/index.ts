export * from './members.ts';
export * from './bundles.ts';
