import { useEffect, useState } from 'react';
import { useController } from 'react-hook-form';
import { defaultCountryFor } from '../utils/address-defaults.ts';
import { countryChoices, startingCountry } from '../utils/countries.ts';
import { useGuildPostageCountries, useGuildSummary } from '../utils/guild-session.ts';
import { FieldError, FieldShell, Select } from './ui/field.tsx';
import { TextField } from './ui/form.tsx';

/**
 * The postal code and country inputs (postalAddressSchema's rules), inside a Form: part of a whole
 * address at checkout, and alone where the bundle page quotes postage to a postal code.
 */
export function PostalCodeField({ name }: { name: string }) {
  return <TextField name={name} label="Postal code" autoComplete="shipping postal-code" autoCapitalize="characters" spellCheck={false} />;
}

/**
 * The country, chosen from those the guild's postage table covers (every country when it covers any address),
 * and still sent as its two-letter code. A guild that posts within one country shows it as plain text.
 */
export function CountryField({ name }: { name: string }) {
  const covered = useGuildPostageCountries();
  const currency = useGuildSummary()?.currency ?? '';
  // Controlled, so the select always shows the form's value (the saved country), never just its first option.
  const { field, fieldState } = useController({ name });
  const error = fieldState.error?.message;
  const current = typeof field.value === 'string' ? field.value : '';
  // Choices follow the country the form opened with, so switching away from a saved one can be undone.
  const [opened] = useState(current);
  const choices = countryChoices(covered, opened);
  const start = startingCountry(choices, current, defaultCountryFor(currency, covered));

  // A value that is no choice (empty, or "UN" typed into the old text box) becomes one, so what is shown is what is sent.
  const { onChange } = field;
  useEffect(() => {
    if (start !== current) onChange(start);
  }, [start, current, onChange]);

  if (choices.only) {
    return (
      <div className="space-y-1.5">
        <p className="font-semibold">Country</p>
        <p className="flex min-h-11 items-center">{choices.only.label}</p>
        <p className="text-thread-soft">The guild posts within {choices.only.label} only.</p>
        {error ? <FieldError>{error}</FieldError> : null}
      </div>
    );
  }
  return (
    <FieldShell
      label="Country"
      hint={
        choices.uncovered && choices.uncovered.value === start
          ? `The guild’s postage table has no rates for ${choices.uncovered.label}: bundles can be collected at a guild meeting instead.`
          : undefined
      }
      error={error}
    >
      {(control) => (
        <Select
          {...control}
          ref={field.ref}
          name={field.name}
          value={start}
          onChange={(event) => field.onChange(event.target.value)}
          onBlur={field.onBlur}
          options={choices.options}
          autoComplete="shipping country"
        />
      )}
    </FieldShell>
  );
}
