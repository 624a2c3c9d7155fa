import type { FieldValues, Path, UseFormReturn } from 'react-hook-form';
import { ApiError, isApiError } from './api-client.ts';

/**
 * The shared Form places only top-level field errors from the API; nested ones
 * (`address.postalCode`, `bands.3.zone`) would land in its summary, away from
 * the row they belong to. This puts every field error whose name starts with one
 * of `prefixes` on its input (focusing the first) and returns the error with the
 * rest, for the Form to show.
 */
export function placeNestedFieldErrors<TIn extends FieldValues, TOut extends FieldValues>(
  error: unknown,
  methods: UseFormReturn<TIn, unknown, TOut>,
  prefixes: readonly string[],
): unknown {
  if (!isApiError(error)) return error;
  const rest: Record<string, string> = {};
  let focus = true;
  for (const [field, message] of Object.entries(error.fields)) {
    if (prefixes.some((prefix) => field.startsWith(prefix))) {
      methods.setError(field as Path<TIn>, { type: 'server', message }, { shouldFocus: focus });
      focus = false;
    } else {
      rest[field] = message;
    }
  }
  return new ApiError(error.status, error.code, error.message, rest);
}
