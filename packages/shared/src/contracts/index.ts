export * from './errors.ts';
export * from './session.ts';
export * from './bundles.ts';
export * from './orders.ts';
export * from './office.ts';
export * from './starter.ts';
