import { formatWeight, type UnitSystem } from '@scrap-relay/shared';
import { useState } from 'react';
import { Controller, get, useFormContext, useFormState, useWatch, type FieldError as HookFieldError } from 'react-hook-form';
import { FieldError, FieldShell, Input, Select } from '../../../components/ui/field.tsx';
import { majorTextToMinor, minorToMajorText } from '../../../utils/units.ts';

/** The error message at `name`, for a whole list (`zones`) as well as one field. */
export function useErrorAt(name: string): string | undefined {
  const { errors } = useFormState({ name });
  const error = (get(errors, `${name}.root`) ?? get(errors, name)) as HookFieldError | undefined;
  return typeof error?.message === 'string' && error.message ? error.message : undefined;
}

/** A message about a whole list (e.g. two zones with one code), shown above the list's rows. */
export function ListError({ name }: { name: string }) {
  const message = useErrorAt(name);
  return message ? (
    <div role="alert">
      <FieldError>{message}</FieldError>
    </div>
  ) : null;
}

const splitPrefixes = (text: string): string[] =>
  text
    .split(/[,\s]+/)
    .map((part) => part.trim())
    .filter(Boolean);

/** A list of short codes typed in one box, separated by commas or spaces: postal-code prefixes, country codes. */
export function PrefixesField({ name, label, hint = 'Separate prefixes with commas or spaces; * matches every postal code.' }: { name: string; label: string; hint?: string }) {
  const { control } = useFormContext();
  const listError = useErrorAt(name);
  const { errors } = useFormState({ name });
  const error = listError ?? firstItemError(errors, name);
  return (
    <FieldShell label={label} hint={hint} error={error}>
      {(shell) => (
        <Controller
          name={name}
          control={control}
          render={({ field }) => <PrefixesInput {...shell} value={field.value as string[]} onChange={field.onChange} onBlur={field.onBlur} inputRef={field.ref} />}
        />
      )}
    </FieldShell>
  );
}

function firstItemError(errors: object, name: string): string | undefined {
  const list = get(errors, name) as Array<HookFieldError | undefined> | undefined;
  if (!Array.isArray(list)) return undefined;
  const first = list.find((item) => typeof item?.message === 'string');
  return first?.message;
}

interface PrefixesInputProps {
  id: string;
  'aria-describedby'?: string;
  'aria-invalid'?: true;
  value: string[];
  onChange: (value: string[]) => void;
  onBlur: () => void;
  inputRef: (element: HTMLInputElement | null) => void;
}

function PrefixesInput({ value, onChange, inputRef, ...rest }: PrefixesInputProps) {
  const [text, setText] = useState(() => value.join(', '));
  // Follow outside changes (a reset after saving) without rewriting what is being typed.
  if (splitPrefixes(text).join(',') !== value.join(',')) setText(value.join(', '));
  return (
    <Input
      {...rest}
      ref={inputRef}
      autoComplete="off"
      spellCheck={false}
      value={text}
      onChange={(event) => {
        setText(event.target.value);
        onChange(splitPrefixes(event.target.value));
      }}
    />
  );
}

/** A price in the guild's currency that may be left empty ("no flat price"): empty is stored as null. */
export function OptionalMoneyField({ name, label, hint, currency }: { name: string; label: string; hint: string; currency: string }) {
  const { control } = useFormContext();
  const error = useErrorAt(name);
  return (
    <FieldShell label={label} hint={hint} error={error}>
      {(shell) => (
        <Controller
          name={name}
          control={control}
          render={({ field }) => (
            <OptionalMoneyInput {...shell} currency={currency} value={field.value as number | null} onChange={field.onChange} onBlur={field.onBlur} inputRef={field.ref} />
          )}
        />
      )}
    </FieldShell>
  );
}

interface OptionalMoneyInputProps {
  id: string;
  'aria-describedby'?: string;
  'aria-invalid'?: true;
  currency: string;
  value: number | null;
  onChange: (value: number | null) => void;
  onBlur: () => void;
  inputRef: (element: HTMLInputElement | null) => void;
}

function OptionalMoneyInput({ currency, value, onChange, inputRef, ...rest }: OptionalMoneyInputProps) {
  const toText = (minor: number | null) => (minor === null ? '' : minorToMajorText(minor, currency));
  const fromText = (text: string) => (text.trim() === '' ? null : majorTextToMinor(text, currency));
  const [text, setText] = useState(() => toText(value));
  const read = fromText(text);
  if (!Object.is(read, value) && !(typeof value === 'number' && Number.isNaN(value)) && toText(value) !== text) setText(toText(value));
  return (
    <Input
      {...rest}
      ref={inputRef}
      type="text"
      inputMode="decimal"
      className="max-w-40"
      value={text}
      onChange={(event) => {
        setText(event.target.value);
        onChange(fromText(event.target.value));
      }}
    />
  );
}

/** A band's zone, chosen from the zones above; an unknown code (from an older table) stays visible so its error makes sense. */
export function BandZoneField({ name, label, className }: { name: string; label: string; className?: string }) {
  const { register, control } = useFormContext();
  const zones = (useWatch({ control, name: 'zones' }) as Array<{ code?: string }> | undefined) ?? [];
  const current = useWatch({ control, name }) as string | undefined;
  const error = useErrorAt(name);
  const codes = [...new Set(zones.map((zone) => zone.code?.trim() ?? '').filter(Boolean))];
  if (current && !codes.includes(current)) codes.push(current);
  return (
    <FieldShell label={label} error={error} className={className}>
      {(shell) => <Select {...shell} options={codes.map((code) => ({ value: code, label: code }))} {...register(name)} />}
    </FieldShell>
  );
}

/** Grams read back in pounds and ounces for an admin who thinks in them, so 907 g is seen to be about 2 lb. */
export function WeightEcho({ name, units }: { name: string; units: UnitSystem }) {
  const grams = useWatch({ name }) as unknown;
  if (units !== 'imperial' || typeof grams !== 'number' || !Number.isInteger(grams) || grams <= 0) return null;
  return <p className="text-thread-soft">= {formatWeight(grams, units)}</p>;
}
