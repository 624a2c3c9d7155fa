export * from './members.ts';
export * from './bundles.ts';
export * from './orders.ts';
export * from './profile.ts';
