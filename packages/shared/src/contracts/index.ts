export * from './errors.ts';
export * from './session.ts';
