/**
 * A problem the developer can act on (port taken, PostgreSQL missing, a
 * service that would not start). Printed as its message only, without a stack
 * trace, because the trace would say nothing about the fix.
 */
export class SetupError extends Error {
  override name = 'SetupError';
}
