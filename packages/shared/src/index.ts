export * from './domain/index.ts';
export * from './schemas/index.ts';
export * from './contracts/index.ts';
