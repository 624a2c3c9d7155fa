import { EMAIL_KIND_LABELS, OPTIONAL_EMAIL_KINDS, profileUpdateSchema, type OptionalEmailKind, type UnitSystem } from '@scrap-relay/shared';
import { useState } from 'react';
import { Alert } from '../../../components/ui/alert.tsx';
import { CheckboxField, FieldGroup, Form, SelectField, SubmitButton, TextField } from '../../../components/ui/form.tsx';
import { useUpdateProfile } from '../api/update-profile.ts';
import type { Profile } from '../types.ts';

const UNIT_OPTIONS = [
  { value: 'imperial', label: 'Inches, yards, ounces and pounds' },
  { value: 'metric', label: 'Centimetres, metres, grams and kilograms' },
];

/** Every optional kind as a box: on unless the member turned it off. */
const preferencesOf = (profile: Profile): Record<OptionalEmailKind, boolean> =>
  Object.fromEntries(OPTIONAL_EMAIL_KINDS.map((kind) => [kind, profile.emailPreferences[kind] !== false])) as Record<OptionalEmailKind, boolean>;

export interface ProfileFormProps {
  profile: Profile;
  /** The units the member reads now: their own choice, or the guild's default while they have none. */
  currentUnits: UnitSystem;
  /** Lets the app pick up a new name or units everywhere. */
  onSaved: (profile: Profile) => Promise<void> | void;
}

/** Name, units and e-mail choices, saved together. */
export function ProfileForm({ profile, currentUnits, onSaved }: ProfileFormProps) {
  const update = useUpdateProfile();
  const [saved, setSaved] = useState<string | null>(null);
  return (
    <Form
      schema={profileUpdateSchema}
      defaultValues={{ name: profile.name, units: currentUnits, emailPreferences: preferencesOf(profile) }}
      onSubmit={async (values, methods) => {
        setSaved(null);
        // Members who never chose keep following the guild's default unless they pick the other units.
        const keepsDefault = profile.units === null && values.units === currentUnits;
        const { profile: next } = await update.mutateAsync(keepsDefault ? { ...values, units: undefined } : values);
        const nextUnits = next.units ?? currentUnits;
        methods.reset({ name: next.name, units: nextUnits, emailPreferences: preferencesOf(next) });
        await onSaved(next);
        setSaved(
          nextUnits !== currentUnits
            ? `Saved. Weights and lengths now show in ${nextUnits === 'metric' ? 'metric units' : 'inches, yards, ounces and pounds'} everywhere.`
            : 'Saved.',
        );
      }}
    >
      <div className="grid gap-5 sm:grid-cols-2">
        <TextField name="name" label="Your name" hint="As other members see it." autoComplete="name" />
        <SelectField name="units" label="Units" hint="For weights, lengths and yields." options={UNIT_OPTIONS} />
      </div>
      <FieldGroup
        legend="E-mails you receive"
        description="Some e-mails are always sent: about money (sales, payments, refunds and payouts), your account’s security (confirming your address, resetting your password), your own bundles coming off the shelf, starter-bundle offers held for you, and a change to a meeting where you hand over or collect."
      >
        {OPTIONAL_EMAIL_KINDS.map((kind) => (
          <CheckboxField key={kind} name={`emailPreferences.${kind}`} label={EMAIL_KIND_LABELS[kind]} />
        ))}
      </FieldGroup>
      {saved ? <Alert tone="success" title={saved} /> : null}
      <SubmitButton pendingLabel="Saving…">Save changes</SubmitButton>
    </Form>
  );
}
