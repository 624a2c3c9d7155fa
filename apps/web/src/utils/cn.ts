/** Joins class names, skipping falsy ones, so variants can be written as `cond && 'class'`. */
export function cn(...parts: Array<string | false | null | undefined>): string {
  return parts.filter(Boolean).join(' ');
}
