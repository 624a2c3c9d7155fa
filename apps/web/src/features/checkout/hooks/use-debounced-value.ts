import { useEffect, useState } from 'react';

/** `value` once it has stopped changing for `delayMs`: a quote is asked for a typed postal code, not for every keystroke. */
export function useDebouncedValue<T>(value: T, delayMs: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), delayMs);
    return () => clearTimeout(timer);
  }, [value, delayMs]);
  return settled;
}
