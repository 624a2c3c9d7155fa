import type { ReactNode } from 'react';

/** A short result line inside a table row: errors interrupt, confirmations are polite. */
export function RowMessage({ tone, children }: { tone: 'success' | 'error'; children: ReactNode }) {
  return tone === 'error' ? (
    <p role="alert" className="font-semibold text-madder-deep">
      <span aria-hidden="true">✗ </span>
      {children}
    </p>
  ) : (
    <p role="status" className="font-semibold text-sage">
      <span aria-hidden="true">✓ </span>
      {children}
    </p>
  );
}
