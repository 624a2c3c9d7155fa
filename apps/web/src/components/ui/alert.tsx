import type { ReactNode } from 'react';
import { cn } from '../../utils/cn.ts';

export type AlertTone = 'error' | 'success' | 'info' | 'warning';

const tones: Record<AlertTone, { box: string; mark: string; label: string }> = {
  error: { box: 'border-madder bg-madder-wash', mark: '!', label: 'Problem' },
  success: { box: 'border-sage bg-sage-wash', mark: '✓', label: 'Done' },
  info: { box: 'border-thread-soft bg-muslin', mark: 'i', label: 'Note' },
  warning: { box: 'border-ochre bg-ochre-wash', mark: '!', label: 'Please note' },
};

export interface AlertProps {
  tone?: AlertTone;
  title?: ReactNode;
  children?: ReactNode;
  className?: string;
  /**
   * Errors interrupt (role="alert"); other tones are polite (role="status").
   * Set `announce={false}` for standing notices that are on the page from the start.
   */
  announce?: boolean;
}

export function Alert({ tone = 'info', title, children, className, announce = true }: AlertProps) {
  const role = announce ? (tone === 'error' ? 'alert' : 'status') : undefined;
  const style = tones[tone];
  return (
    <div role={role} className={cn('flex gap-3 rounded-stitch border-l-8 p-4 text-thread', style.box, className)}>
      <span
        aria-hidden="true"
        className="mt-0.5 flex size-7 shrink-0 items-center justify-center rounded-full bg-thread text-base font-bold text-white"
      >
        {style.mark}
      </span>
      <div className="min-w-0 space-y-2">
        <span className="sr-only">{style.label}: </span>
        {title ? <p className="font-semibold">{title}</p> : null}
        {children}
      </div>
    </div>
  );
}
