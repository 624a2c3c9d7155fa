import type { ButtonHTMLAttributes, ReactNode } from 'react';
import { Link, type LinkProps } from 'react-router-dom';
import { cn } from '../../utils/cn.ts';

export type ButtonVariant = 'primary' | 'secondary' | 'danger' | 'quiet';

const base =
  'inline-flex min-h-11 min-w-11 items-center justify-center gap-2 rounded-stitch px-5 py-2 text-base font-semibold leading-tight no-underline transition-colors disabled:cursor-not-allowed disabled:opacity-60';

const variants: Record<ButtonVariant, string> = {
  primary: 'bg-thread text-white hover:bg-thread-soft hover:text-white',
  secondary: 'border-2 border-thread bg-muslin text-thread hover:bg-linen-deep hover:text-thread',
  danger: 'bg-madder text-white hover:bg-madder-deep hover:text-white',
  quiet: 'px-3 text-madder-deep underline underline-offset-4 hover:text-madder',
};

export const buttonClass = (variant: ButtonVariant = 'primary', className?: string) => cn(base, variants[variant], className);

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: ButtonVariant;
  /** While true the button is disabled and shows `pendingLabel` so people know their tap registered. */
  isPending?: boolean;
  pendingLabel?: ReactNode;
}

export function Button({ variant = 'primary', isPending = false, pendingLabel, className, children, disabled, type = 'button', ...rest }: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClass(variant, className)}
      disabled={disabled || isPending}
      aria-busy={isPending || undefined}
      {...rest}
    >
      {isPending && pendingLabel ? pendingLabel : children}
    </button>
  );
}

export interface ButtonLinkProps extends LinkProps {
  variant?: ButtonVariant;
}

export function ButtonLink({ variant = 'primary', className, ...rest }: ButtonLinkProps) {
  return <Link className={buttonClass(variant, className)} {...rest} />;
}
