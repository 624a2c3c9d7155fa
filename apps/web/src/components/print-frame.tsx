import type { ReactNode } from 'react';
import './print-frame.css';

/**
 * Wraps a page that is meant to be printed (handover sheet, statement, dashboard).
 * While one is on screen, printing leaves off the app's header, menu and footer and
 * prints black on white; the page marks its own screen-only controls `print:hidden`.
 */
export function PrintFrame({ children, className }: { children: ReactNode; className?: string }) {
  return (
    <div data-print-frame="" className={className}>
      {children}
    </div>
  );
}
