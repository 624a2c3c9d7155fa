export * from './members.ts';
