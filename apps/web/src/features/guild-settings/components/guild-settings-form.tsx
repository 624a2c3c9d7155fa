import { CURRENCIES, guildSettingsSchema, type GuildSettings } from '@scrap-relay/shared';
import { useState } from 'react';
import { useWatch } from 'react-hook-form';
import { Alert } from '../../../components/ui/alert.tsx';
import {
  CheckboxField,
  FieldGroup,
  Form,
  NumberField,
  ScaledNumberField,
  SelectField,
  SubmitButton,
  TextField,
} from '../../../components/ui/form.tsx';
import {
  basisPointsToPercentText,
  majorTextToMinor,
  minorToMajorText,
  percentTextToBasisPoints,
} from '../../../utils/units.ts';
import { useUpdateGuildSettings } from '../api/update-guild-settings.ts';

const shape = guildSettingsSchema.shape;

/** "from 7 to 365" straight from the shared schema, so hints never drift from what the API accepts. */
const range = (field: { minValue: number | null; maxValue: number | null }, scale = (n: number) => String(n)) =>
  `from ${scale(field.minValue ?? 0)} to ${scale(field.maxValue ?? 0)}`;
const percent = (basisPoints: number) => basisPointsToPercentText(basisPoints);

// Wording for range checks the schema states without a message of its own.
const messages: Partial<Record<keyof GuildSettings, string>> = {
  guildFeeBasisPoints: `Enter a percentage ${range(shape.guildFeeBasisPoints, percent)}, with at most two decimals.`,
  processingPercentBasisPoints: `Enter a percentage ${range(shape.processingPercentBasisPoints, percent)}, with at most two decimals.`,
  processingFixedMinor: 'Enter an amount such as 0.30 (no more decimals than the currency has).',
  starterLimitPerWindow: `Enter a whole number ${range(shape.starterLimitPerWindow)}.`,
  starterWindowDays: `Enter a whole number of days ${range(shape.starterWindowDays)}.`,
  starterOfferHours: `Enter a whole number of hours ${range(shape.starterOfferHours)}.`,
};

const currencyOptions = CURRENCIES.map((code) => ({ value: code, label: code }));
const timeZoneOptions = ['UTC', ...Intl.supportedValuesOf('timeZone')].map((zone) => ({ value: zone, label: zone.replaceAll('_', ' ') }));
const unitOptions = [
  { value: 'imperial', label: 'Inches, yards and ounces' },
  { value: 'metric', label: 'Centimetres, metres and grams' },
];

export function GuildSettingsForm({ settings, onSaved }: { settings: GuildSettings; onSaved?: (settings: GuildSettings) => void }) {
  const [savedAt, setSavedAt] = useState<Date | null>(null);
  const update = useUpdateGuildSettings();

  return (
    <Form
      schema={guildSettingsSchema}
      defaultValues={settings}
      messages={messages}
      aria-labelledby="guild-settings-heading"
      onSubmit={async (values, methods) => {
        setSavedAt(null);
        const { settings: saved } = await update.mutateAsync(values);
        methods.reset(saved);
        setSavedAt(new Date());
        onSaved?.(saved);
      }}
    >
      <h2 id="guild-settings-heading" className="sr-only">
        Guild settings
      </h2>
      <FieldGroup legend="The guild">
        <TextField name="name" label="Guild name" hint="Shown in the header of every page and in e-mails." autoComplete="organization" />
        <TextField name="town" label="Town" hint="Where the guild meets. You may leave it empty." autoComplete="address-level2" />
        <SelectField name="timeZone" label="Time zone" hint="E-mails give meeting times and deadlines in this zone." options={timeZoneOptions} />
      </FieldGroup>

      <FieldGroup legend="Money and units">
        <SelectField name="currency" label="Currency" hint="Prices, postage, fees and payouts are all in this currency. It can change only before the first price is entered." options={currencyOptions} />
        <SelectField
          name="defaultUnits"
          label="Units for new members"
          hint="Each member can switch to the other units for themselves."
          options={unitOptions}
        />
        <ScaledNumberField
          name="guildFeeBasisPoints"
          label="Guild fee (%)"
          hint={`The share of each sale price the guild keeps, ${range(shape.guildFeeBasisPoints, percent)} %. For example 10 for ten per cent.`}
          toText={basisPointsToPercentText}
          fromText={percentTextToBasisPoints}
        />
        <ScaledNumberField
          name="processingPercentBasisPoints"
          label="Card processing: percentage part (%)"
          hint="What the card processor takes from each payment as a percentage; used to estimate costs in the ledger."
          toText={basisPointsToPercentText}
          fromText={percentTextToBasisPoints}
        />
        <ProcessingFixedField />
      </FieldGroup>

      <FieldGroup legend="Shelf and checkout">
        <NumberField
          name="shelfLimitDays"
          label="Days a bundle stays on the shelf"
          hint={`After this many days an unsold bundle expires and goes back to its owner; ${range(shape.shelfLimitDays)} days.`}
        />
        <NumberField
          name="holdMinutes"
          label="Minutes a bundle is held while someone pays"
          hint={`If payment is not finished in time the bundle goes back on the shelf; ${range(shape.holdMinutes)} minutes.`}
        />
      </FieldGroup>

      <FieldGroup legend="New quilters and starter bundles">
        <NumberField
          name="newcomerWindowMonths"
          label="Months a new member counts as a new quilter"
          hint={`Counted from the day they joined; ${range(shape.newcomerWindowMonths)} months. With 0, only members flagged by the librarian count.`}
        />
        <NumberField
          name="starterLimitPerWindow"
          label="Starter bundles per new quilter"
          hint={`How many starter bundles one new quilter may claim in each period below; ${range(shape.starterLimitPerWindow)}.`}
        />
        <NumberField
          name="starterWindowDays"
          label="Length of that period (days)"
          hint={`The claim limit above starts again after this many days; ${range(shape.starterWindowDays)}. For example 90 allows one claim a quarter.`}
        />
        <NumberField
          name="starterOfferHours"
          label="Hours to accept an offered starter bundle"
          hint={`When a bundle is offered to the next new quilter on the waitlist, they have this long to accept; ${range(shape.starterOfferHours)} hours.`}
        />
        <CheckboxField
          name="starterPostingAllowed"
          label="Starter bundles may be posted"
          hint="When unticked, starter bundles are only handed over at a guild meeting."
        />
      </FieldGroup>

      <div className="space-y-4">
        <SubmitButton pendingLabel="Saving…">Save settings</SubmitButton>
        {savedAt ? (
          <Alert tone="success" title="Settings saved">
            <p>The new settings apply from now on.</p>
          </Alert>
        ) : null}
      </div>
    </Form>
  );
}

/** The fixed part is stored in minor units; shown in the currency currently chosen above. */
function ProcessingFixedField() {
  const currency = useWatch<GuildSettings, 'currency'>({ name: 'currency' });
  return (
    <ScaledNumberField
      key={currency}
      name="processingFixedMinor"
      label={`Card processing: fixed part per payment (${currency})`}
      hint="What the card processor charges per payment on top of the percentage, for example 0.30."
      toText={(minor) => minorToMajorText(minor, currency)}
      fromText={(text) => majorTextToMinor(text, currency)}
    />
  );
}
