import type { z } from 'zod';
import { validationFailed } from '../errors/index.ts';

/** Parses request input with the shared zod schema; a failure becomes a 400 naming each field. */
export function parseInput<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const result = schema.safeParse(value ?? {});
  if (!result.success) throw validationFailed(result.error);
  return result.data;
}
