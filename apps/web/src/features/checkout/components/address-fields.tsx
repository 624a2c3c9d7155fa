import { CountryField, PostalCodeField } from '../../../components/postal-fields.tsx';
import { TextField } from '../../../components/ui/form.tsx';

/**
 * The postal address inputs (postalAddressSchema), inside a Form. `prefix` is
 * where the address sits in the form's values ("address." in checkout, "" when
 * the address is the whole form). Autocomplete tokens let phones fill it in.
 */
export function AddressFields({ prefix = '' }: { prefix?: string }) {
  const name = (field: string) => `${prefix}${field}`;
  return (
    <div className="grid gap-5 sm:grid-cols-2">
      <TextField name={name('name')} label="Name on the parcel" autoComplete="shipping name" className="sm:col-span-2" />
      <TextField name={name('line1')} label="Street address" autoComplete="shipping address-line1" className="sm:col-span-2" />
      <TextField
        name={name('line2')}
        label="Flat, unit or building (optional)"
        autoComplete="shipping address-line2"
        className="sm:col-span-2"
      />
      <TextField name={name('town')} label="Town or city" autoComplete="shipping address-level2" />
      <TextField name={name('region')} label="State, province or county (optional)" autoComplete="shipping address-level1" />
      <PostalCodeField name={name('postalCode')} />
      <CountryField name={name('country')} />
    </div>
  );
}
