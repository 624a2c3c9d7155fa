import { useId, type InputHTMLAttributes, type ReactNode, type Ref, type SelectHTMLAttributes } from 'react';
import { cn } from '../../utils/cn.ts';

/** Props a control needs so its label, hint and error are read out with it. */
export interface ControlProps {
  id: string;
  'aria-describedby'?: string;
  'aria-invalid'?: true;
}

export interface FieldShellProps {
  label: ReactNode;
  hint?: ReactNode;
  error?: string | undefined;
  className?: string;
  children: (control: ControlProps) => ReactNode;
}

/** Label above, hint under the label, error under the control; hint and error are tied to the control by id. */
export function FieldShell({ label, hint, error, className, children }: FieldShellProps) {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className={cn('space-y-1.5', className)}>
      <label htmlFor={id} className="block font-semibold">
        {label}
      </label>
      {hint ? (
        <p id={hintId} className="text-thread-soft">
          {hint}
        </p>
      ) : null}
      {children({ id, 'aria-describedby': describedBy, 'aria-invalid': error ? true : undefined })}
      {error ? <FieldError id={errorId}>{error}</FieldError> : null}
    </div>
  );
}

export function FieldError({ id, children }: { id?: string; children: ReactNode }) {
  return (
    <p id={id} className="flex items-start gap-2 font-semibold text-madder-deep">
      <span aria-hidden="true">✗</span>
      <span>{children}</span>
    </p>
  );
}

export const controlClass =
  'block min-h-11 w-full rounded-stitch border-2 border-selvage bg-muslin px-3 py-2 text-base text-thread placeholder:text-thread-soft aria-invalid:border-madder aria-invalid:bg-madder-wash/40 disabled:bg-linen-deep';

export type InputProps = InputHTMLAttributes<HTMLInputElement>;

export function Input({ className, ref, ...rest }: InputProps & { ref?: Ref<HTMLInputElement> }) {
  return <input ref={ref} className={cn(controlClass, className)} {...rest} />;
}

export interface SelectOption {
  value: string;
  label: string;
}

export interface SelectProps extends SelectHTMLAttributes<HTMLSelectElement> {
  options: readonly SelectOption[];
  ref?: Ref<HTMLSelectElement>;
}

export function Select({ options, className, ref, ...rest }: SelectProps) {
  return (
    <select ref={ref} className={cn(controlClass, 'appearance-auto pr-8', className)} {...rest}>
      {options.map((option) => (
        <option key={option.value} value={option.value}>
          {option.label}
        </option>
      ))}
    </select>
  );
}

export interface CheckboxProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'type'> {
  label: ReactNode;
  hint?: ReactNode;
  ref?: Ref<HTMLInputElement>;
}

/** A checkbox whose whole row is the touch target (label wraps the box). */
export function Checkbox({ label, hint, className, ref, id, ...rest }: CheckboxProps) {
  const autoId = useId();
  const inputId = id ?? autoId;
  const hintId = hint ? `${inputId}-hint` : undefined;
  return (
    <div className={cn('flex items-start gap-3', className)}>
      <input
        ref={ref}
        id={inputId}
        type="checkbox"
        aria-describedby={hintId}
        className="mt-1.5 size-6 shrink-0 accent-thread disabled:opacity-60"
        {...rest}
      />
      <div className="min-h-11">
        <label htmlFor={inputId} className="block cursor-pointer py-1 font-semibold">
          {label}
        </label>
        {hint ? (
          <p id={hintId} className="text-thread-soft">
            {hint}
          </p>
        ) : null}
      </div>
    </div>
  );
}
