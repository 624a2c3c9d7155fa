import type { TextareaHTMLAttributes } from 'react';
import { get, useFormContext, useFormState, type FieldError as HookFieldError } from 'react-hook-form';
import { controlClass, FieldShell } from '../../../components/ui/field.tsx';
import { cn } from '../../../utils/cn.ts';

interface TextAreaFieldProps extends Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'name' | 'id'> {
  name: string;
  label: string;
  hint?: string;
}

/** A several-line text box inside a Form (the shared form kit has single-line fields only). */
export function TextAreaField({ name, label, hint, className, rows = 4, ...rest }: TextAreaFieldProps) {
  const { register } = useFormContext();
  const { errors } = useFormState({ name });
  const error = get(errors, name) as HookFieldError | undefined;
  return (
    <FieldShell label={label} hint={hint} error={typeof error?.message === 'string' ? error.message : undefined} className={className}>
      {(control) => <textarea {...control} rows={rows} className={cn(controlClass, 'min-h-24')} {...rest} {...register(name)} />}
    </FieldShell>
  );
}
