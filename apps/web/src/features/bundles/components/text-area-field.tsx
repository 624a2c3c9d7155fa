import { get, useFormContext, useFormState, type FieldError as HookFieldError } from 'react-hook-form';
import { FieldShell, controlClass } from '../../../components/ui/field.tsx';
import { cn } from '../../../utils/cn.ts';

/** A bound multi-line field, styled and labelled like the shared single-line ones. */
export function TextAreaField({ name, label, hint, rows = 4 }: { name: string; label: string; hint?: string; rows?: number }) {
  const { register } = useFormContext();
  const { errors } = useFormState({ name });
  const error = (get(errors, name) as HookFieldError | undefined)?.message;
  return (
    <FieldShell label={label} hint={hint} error={typeof error === 'string' && error ? error : undefined}>
      {(control) => <textarea {...control} rows={rows} className={cn(controlClass, 'resize-y')} {...register(name)} />}
    </FieldShell>
  );
}
