import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useMemo, useRef, useState, type InputHTMLAttributes, type ReactNode } from 'react';
import {
  Controller,
  FormProvider,
  get,
  useForm,
  useFormContext,
  useFormState,
  type DefaultValues,
  type FieldError as HookFieldError,
  type FieldValues,
  type Path,
  type UseFormReturn,
} from 'react-hook-form';
import type { z } from 'zod';
import { isApiError, type ApiError } from '../../lib/api-client.ts';
import { Alert } from './alert.tsx';
import { Button, type ButtonProps } from './button.tsx';
import { Checkbox, FieldShell, Input, Select, type SelectOption } from './field.tsx';

interface SubmitFailure {
  message: string;
  /** Field messages the form has no field for (shown in the alert instead). */
  unplaced: string[];
  apiError: ApiError | null;
}

export interface FormProps<TInput extends FieldValues, TOutput extends FieldValues> {
  /** The shared zod input schema (from `@scrap-relay/shared`) the API validates with too. */
  schema: z.ZodType<TOutput, TInput>;
  defaultValues: DefaultValues<TInput>;
  /** Throw (or let the mutation throw) an ApiError: its `fields` land on the fields, its `message` in the alert. */
  onSubmit: (values: TOutput, methods: UseFormReturn<TInput, unknown, TOutput>) => Promise<unknown> | unknown;
  children: ReactNode | ((methods: UseFormReturn<TInput, unknown, TOutput>) => ReactNode);
  /**
   * Friendlier wording per field for checks the schema states without a message
   * (e.g. a range). Messages written in the schema always win.
   */
  messages?: Partial<Record<string, string>>;
  /** Extra help under the error message for particular codes (e.g. a link to ask for a new one). */
  errorDetail?: (error: ApiError) => ReactNode;
  className?: string;
  id?: string;
  'aria-labelledby'?: string;
}

const UNEXPECTED = 'Something went wrong. Please try again.';

/**
 * react-hook-form + zodResolver with the API's error shape wired in. Children
 * use the field components below (TextField, NumberField, …), which find the
 * form through context.
 */
export function Form<TInput extends FieldValues, TOutput extends FieldValues>({
  schema,
  defaultValues,
  onSubmit,
  children,
  messages,
  errorDetail,
  className,
  ...formAttributes
}: FormProps<TInput, TOutput>) {
  const resolver = useMemo(
    () =>
      zodResolver(schema, {
        error: (issue) => {
          const field = issue.path?.[0];
          return typeof field === 'string' ? messages?.[field] : undefined;
        },
      }),
    [schema, messages],
  );
  const methods = useForm<TInput, unknown, TOutput>({ resolver, defaultValues, mode: 'onTouched' });
  const [failure, setFailure] = useState<SubmitFailure | null>(null);
  const alertRef = useRef<HTMLDivElement>(null);

  useEffect(() => {
    if (failure) alertRef.current?.scrollIntoView?.({ block: 'nearest' });
  }, [failure]);

  const submit = methods.handleSubmit(async (values) => {
    setFailure(null);
    try {
      await onSubmit(values, methods);
    } catch (error) {
      if (!isApiError(error)) {
        console.error(error);
        setFailure({ message: UNEXPECTED, unplaced: [], apiError: null });
        return;
      }
      const known = new Set(Object.keys(methods.getValues()));
      const unplaced: string[] = [];
      let focusNext = true;
      for (const [field, message] of Object.entries(error.fields)) {
        if (known.has(field)) {
          methods.setError(field as Path<TInput>, { type: 'server', message }, { shouldFocus: focusNext });
          focusNext = false;
        } else {
          unplaced.push(message);
        }
      }
      setFailure({ message: error.message, unplaced, apiError: error });
    }
  });

  return (
    <FormProvider {...methods}>
      <form noValidate onSubmit={submit} className={className ?? 'space-y-6'} {...formAttributes}>
        {typeof children === 'function' ? children(methods) : children}
        {failure ? (
          <div ref={alertRef}>
            <Alert tone="error" title={failure.message}>
              {failure.unplaced.length > 0 ? (
                <ul className="list-disc pl-5">
                  {failure.unplaced.map((message) => (
                    <li key={message}>{message}</li>
                  ))}
                </ul>
              ) : null}
              {failure.apiError && errorDetail ? errorDetail(failure.apiError) : null}
            </Alert>
          </div>
        ) : null}
      </form>
    </FormProvider>
  );
}

function useFieldError(name: string): string | undefined {
  const { errors } = useFormState({ name });
  const error = get(errors, name) as HookFieldError | undefined;
  return typeof error?.message === 'string' && error.message.length > 0 ? error.message : undefined;
}

export function SubmitButton({ children, pendingLabel, ...rest }: Omit<ButtonProps, 'type' | 'isPending'>) {
  const { isSubmitting } = useFormState();
  return (
    <Button type="submit" isPending={isSubmitting} pendingLabel={pendingLabel} {...rest}>
      {children}
    </Button>
  );
}

type NativeInputProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'name' | 'id' | 'children'>;

interface BoundFieldProps {
  name: string;
  label: ReactNode;
  hint?: ReactNode;
  className?: string;
}

export function TextField({ name, label, hint, className, ...input }: BoundFieldProps & NativeInputProps) {
  const { register } = useFormContext();
  const error = useFieldError(name);
  return (
    <FieldShell label={label} hint={hint} error={error} className={className}>
      {(control) => <Input {...control} {...input} {...register(name)} />}
    </FieldShell>
  );
}

/** Password with a show/hide switch: easier than a second "repeat" box on a tablet keyboard. */
export function PasswordField({ name, label, hint, className, ...input }: BoundFieldProps & Omit<NativeInputProps, 'type'>) {
  const { register } = useFormContext();
  const error = useFieldError(name);
  const [visible, setVisible] = useState(false);
  return (
    <FieldShell label={label} hint={hint} error={error} className={className}>
      {(control) => (
        <div className="flex gap-2">
          <Input {...control} {...input} type={visible ? 'text' : 'password'} spellCheck={false} autoCapitalize="none" {...register(name)} />
          <Button variant="secondary" aria-pressed={visible} aria-controls={control.id} onClick={() => setVisible((v) => !v)} className="shrink-0 px-3">
            {visible ? 'Hide' : 'Show'}
          </Button>
        </div>
      )}
    </FieldShell>
  );
}

/** A whole number; empty or non-numeric text reaches the schema as NaN and fails there. */
export function NumberField({ name, label, hint, className, ...input }: BoundFieldProps & Omit<NativeInputProps, 'type'>) {
  const { register } = useFormContext();
  const error = useFieldError(name);
  return (
    <FieldShell label={label} hint={hint} error={error} className={className}>
      {(control) => (
        <Input {...control} type="text" inputMode="numeric" className="max-w-40" {...input} {...register(name, { valueAsNumber: true })} />
      )}
    </FieldShell>
  );
}

export interface ScaledNumberFieldProps extends BoundFieldProps {
  /** Stored integer → the text people read (e.g. 1000 basis points → "10"). */
  toText: (value: number) => string;
  /** Typed text → stored integer, NaN when it is not a number. */
  fromText: (text: string) => number;
  inputMode?: 'numeric' | 'decimal';
}

/** Shows a stored integer in the unit people think in (percent, pounds and pence) and converts back as they type. */
export function ScaledNumberField({ name, label, hint, className, toText, fromText, inputMode = 'decimal' }: ScaledNumberFieldProps) {
  const { control: formControl } = useFormContext();
  const error = useFieldError(name);
  return (
    <FieldShell label={label} hint={hint} error={error} className={className}>
      {(control) => (
        <Controller
          name={name}
          control={formControl}
          render={({ field }) => (
            <ScaledInput
              {...control}
              inputMode={inputMode}
              value={field.value as number}
              onChange={field.onChange}
              onBlur={field.onBlur}
              inputRef={field.ref}
              toText={toText}
              fromText={fromText}
            />
          )}
        />
      )}
    </FieldShell>
  );
}

interface ScaledInputProps {
  id: string;
  'aria-describedby'?: string;
  'aria-invalid'?: true;
  inputMode: 'numeric' | 'decimal';
  value: number;
  onChange: (value: number) => void;
  onBlur: () => void;
  inputRef: (element: HTMLInputElement | null) => void;
  toText: (value: number) => string;
  fromText: (text: string) => number;
}

function ScaledInput({ value, onChange, inputRef, toText, fromText, ...rest }: ScaledInputProps) {
  const [text, setText] = useState(() => toText(value));
  // Follow outside changes (a form reset after saving) without fighting the person typing.
  const outside = toText(value);
  if (!Object.is(fromText(text), value) && !Number.isNaN(value) && outside !== text) {
    setText(outside);
  }
  return (
    <Input
      {...rest}
      ref={inputRef}
      type="text"
      className="max-w-40"
      value={text}
      onChange={(event) => {
        setText(event.target.value);
        onChange(fromText(event.target.value));
      }}
    />
  );
}

export function SelectField({ name, label, hint, className, options }: BoundFieldProps & { options: readonly SelectOption[] }) {
  const { register } = useFormContext();
  const error = useFieldError(name);
  return (
    <FieldShell label={label} hint={hint} error={error} className={className}>
      {(control) => <Select {...control} options={options} {...register(name)} />}
    </FieldShell>
  );
}

export function CheckboxField({ name, label, hint, className }: BoundFieldProps) {
  const { register } = useFormContext();
  const error = useFieldError(name);
  return (
    <div className={className}>
      <Checkbox label={label} hint={hint} aria-invalid={error ? true : undefined} {...register(name)} />
      {error ? <p className="font-semibold text-madder-deep">{error}</p> : null}
    </div>
  );
}

/** A titled group of fields (fieldset + legend) so screen readers announce the group. */
export function FieldGroup({ legend, description, children }: { legend: ReactNode; description?: ReactNode; children: ReactNode }) {
  return (
    <fieldset className="space-y-5 rounded-stitch border-2 border-seam bg-muslin p-4 sm:p-6">
      <legend className="px-2 text-lg font-bold">{legend}</legend>
      {description ? <p className="text-thread-soft">{description}</p> : null}
      {children}
    </fieldset>
  );
}
