export * from './app-error.ts';
export { errorHandler, notFoundHandler } from './handler.ts';
