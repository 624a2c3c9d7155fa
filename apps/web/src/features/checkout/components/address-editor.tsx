import { postalAddressSchema, type PostalAddress } from '@scrap-relay/shared';
import { useState } from 'react';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Form, SubmitButton } from '../../../components/ui/form.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { useMyAddress } from '../../../lib/my-address.ts';
import { useUpdateMyAddress } from '../api/update-my-address.ts';
import { addressFormValues } from '../../../utils/address-defaults.ts';
import { useGuildPostageCountries } from '../../../utils/guild-session.ts';
import { AddressFields } from './address-fields.tsx';

/** The member's saved postal address, used to fill in checkout by post. */
export function AddressEditor({ currency }: { currency: string }) {
  const address = useMyAddress();
  if (address.isPending) return <Loading label="Loading your address…" />;
  if (address.isError) {
    return (
      <Alert tone="error" title="Your address could not be loaded">
        <p>{address.error.message}</p>
        <Button variant="secondary" onClick={() => address.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }
  return <AddressForm saved={address.data.address} currency={currency} />;
}

function AddressForm({ saved, currency }: { saved: PostalAddress | null; currency: string }) {
  const update = useUpdateMyAddress();
  const [savedAt, setSavedAt] = useState<number | null>(null);
  const postageCountries = useGuildPostageCountries();
  return (
    <Form
      schema={postalAddressSchema}
      defaultValues={addressFormValues(saved, currency, postageCountries)}
      onSubmit={async (values, methods) => {
        setSavedAt(null);
        const { address } = await update.mutateAsync(values);
        methods.reset(address);
        setSavedAt(Date.now());
      }}
    >
      <AddressFields />
      <div className="space-y-4">
        <SubmitButton pendingLabel="Saving…">Save address</SubmitButton>
        {savedAt ? (
          <Alert tone="success" title="Address saved">
            <p>Checkout by post will start with this address.</p>
          </Alert>
        ) : null}
      </div>
    </Form>
  );
}
