import { TextField } from './ui/form.tsx';

/**
 * The postal code and country inputs (postalAddressSchema's rules), inside a Form: part of a whole
 * address at checkout, and alone where the bundle page quotes postage to a postal code.
 */
export function PostalCodeField({ name }: { name: string }) {
  return <TextField name={name} label="Postal code" autoComplete="shipping postal-code" autoCapitalize="characters" spellCheck={false} />;
}

export function CountryField({ name }: { name: string }) {
  return (
    <TextField
      name={name}
      label="Country"
      hint="Two-letter code, like US or CA."
      autoComplete="shipping country"
      autoCapitalize="characters"
      maxLength={2}
      spellCheck={false}
      className="[&_input]:max-w-32"
    />
  );
}
