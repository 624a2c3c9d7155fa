import { useEffect, useId, useRef, type ReactNode } from 'react';
import { Button, type ButtonVariant } from './button.tsx';

export interface ConfirmDialogProps {
  open: boolean;
  title: ReactNode;
  children?: ReactNode;
  confirmLabel: string;
  pendingLabel?: string;
  cancelLabel?: string;
  confirmVariant?: ButtonVariant;
  isPending?: boolean;
  onConfirm: () => void;
  onCancel: () => void;
}

/**
 * A modal question built on the native <dialog>: the browser traps focus,
 * closes on Escape and returns focus to the button that opened it.
 */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  pendingLabel,
  cancelLabel = 'Cancel',
  confirmVariant = 'primary',
  isPending = false,
  onConfirm,
  onCancel,
}: ConfirmDialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const bodyId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={children ? bodyId : undefined}
      onCancel={(event) => {
        event.preventDefault();
        if (!isPending) onCancel();
      }}
      className="m-auto w-[min(34rem,calc(100vw-2rem))] rounded-stitch border-2 border-thread bg-muslin p-0 text-thread shadow-quilt backdrop:bg-thread/50"
    >
      <div className="space-y-4 p-6">
        <h2 id={titleId} className="text-xl font-bold">
          {title}
        </h2>
        {children ? (
          <div id={bodyId} className="space-y-3">
            {children}
          </div>
        ) : null}
        <div className="flex flex-col-reverse gap-3 pt-2 sm:flex-row sm:justify-end">
          <Button variant="secondary" onClick={onCancel} disabled={isPending} autoFocus>
            {cancelLabel}
          </Button>
          <Button variant={confirmVariant} onClick={onConfirm} isPending={isPending} pendingLabel={pendingLabel}>
            {confirmLabel}
          </Button>
        </div>
      </div>
    </dialog>
  );
}
