import { postageTableSchema, type PostageTable, type UnitSystem } from '@scrap-relay/shared';
import { useState } from 'react';
import { useFieldArray, useFormContext } from 'react-hook-form';
import type { z } from 'zod';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { CheckboxField, FieldGroup, Form, NumberField, ScaledNumberField, SubmitButton, TextField } from '../../../components/ui/form.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { placeNestedFieldErrors } from '../../../lib/form-errors.ts';
import { majorTextToMinor, minorToMajorText } from '../../../utils/units.ts';
import { usePostageTable } from '../api/get-postage-table.ts';
import { useUpdatePostageTable } from '../api/update-postage-table.ts';
import { BandZoneField, ListError, OptionalMoneyField, PrefixesField, WeightEcho } from './postage-fields.tsx';
import { QuoteRules } from './quote-rules.tsx';
import { TryQuote } from './try-quote.tsx';

type TableValues = z.input<typeof postageTableSchema>;

// Lists whose rows carry their own errors (`bands.3.zone`): API errors there go next to the row.
const ROW_PREFIXES = ['countries.', 'dimensional.', 'zones.', 'bands.', 'packaging.'];

export interface PostageTableEditorProps {
  currency: string;
  units: UnitSystem;
}

export function PostageTableEditor({ currency, units }: PostageTableEditorProps) {
  const table = usePostageTable();
  if (table.isPending) return <Loading label="Loading the postage table…" />;
  if (table.isError) {
    return (
      <Alert tone="error" title="The postage table could not be loaded">
        <p>{table.error.message}</p>
        <Button variant="secondary" onClick={() => table.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }
  return <PostageTableForm table={table.data.postage} currency={currency} units={units} />;
}

function PostageTableForm({ table, currency, units }: { table: PostageTable; currency: string; units: UnitSystem }) {
  const update = useUpdatePostageTable();
  const [savedAt, setSavedAt] = useState<number | null>(null);
  const money = (minor: number) => minorToMajorText(minor, currency);
  const parseMoney = (text: string) => majorTextToMinor(text, currency);
  return (
    <Form
      schema={postageTableSchema}
      // A table saved before the countries list existed has none: every country is quoted.
      defaultValues={{ countries: [], ...structuredClone(table) } as TableValues}
      onSubmit={async (values, methods) => {
        setSavedAt(null);
        try {
          const { postage } = await update.mutateAsync(values);
          methods.reset({ countries: [], ...structuredClone(postage) } as TableValues);
          setSavedAt(Date.now());
        } catch (error) {
          throw placeNestedFieldErrors(error, methods, ROW_PREFIXES);
        }
      }}
      className="grid items-start gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]"
    >
      <div className="space-y-6">
        <QuoteRules />

        <FieldGroup legend="Countries" description="Addresses in other countries get no quote: the buyer chooses a meeting handover or asks the seller.">
          <PrefixesField name="countries" label="Countries these rates are for" hint="Two-letter codes such as US, separated by commas or spaces. Leave empty to quote every address." />
        </FieldGroup>

        <FieldGroup legend="Dimensional weight" description="A large, light box is billed by its size when its volume is over the threshold.">
          <NumberField name="dimensional.divisorCubicInchesPerPound" label="Divisor (cubic inches per pound)" hint="For example 166 or 139, as your carrier publishes." inputMode="decimal" />
          <NumberField name="dimensional.thresholdCubicInches" label="Applies above (cubic inches)" hint="0 means always; 1728 is a 12-inch cube." inputMode="decimal" />
          <CheckboxField name="dimensional.roundEachDimensionUp" label="Round each side up to a whole inch first" hint="Some carriers measure this way." />
        </FieldGroup>

        <ZonesSection />
        <BandsSection currency={currency} units={units} money={money} parseMoney={parseMoney} />
        <PackagingSection currency={currency} units={units} />

        <FieldGroup legend="Handling">
          <ScaledNumberField
            name="handlingMinor"
            label={`Handling charge per order (${currency})`}
            hint="Added once to every posted order, for packing materials."
            toText={money}
            fromText={parseMoney}
          />
        </FieldGroup>

        <div className="space-y-4">
          <SubmitButton pendingLabel="Saving…">Save the postage table</SubmitButton>
          {savedAt ? (
            <Alert tone="success" title="Postage table saved">
              <p>Every quote from now on uses it. Orders already placed keep the postage they were quoted.</p>
            </Alert>
          ) : null}
        </div>
      </div>
      <TryQuote currency={currency} units={units} />
    </Form>
  );
}

function ZonesSection() {
  const { control } = useFormContext<TableValues>();
  const zones = useFieldArray({ control, name: 'zones' });
  return (
    <FieldGroup legend="Zones" description="Checked in this order: the first zone with a matching prefix wins. Keep the catch-all (*) last.">
      <ListError name="zones" />
      {zones.fields.map((field, index) => (
        <fieldset key={field.id} className="space-y-4 rounded-stitch border-2 border-seam p-4">
          <legend className="px-2 font-bold">Zone {index + 1}</legend>
          <div className="grid gap-4 sm:grid-cols-[12rem_1fr]">
            <TextField name={`zones.${index}.code`} label="Code" hint="Lower-case, like local." autoComplete="off" spellCheck={false} />
            <PrefixesField name={`zones.${index}.postalPrefixes`} label="Postal-code prefixes" />
          </div>
          <div className="flex flex-wrap gap-2">
            <Button variant="secondary" onClick={() => zones.move(index, index - 1)} disabled={index === 0}>
              Move up<span className="sr-only"> zone {index + 1}</span>
            </Button>
            <Button variant="secondary" onClick={() => zones.move(index, index + 1)} disabled={index === zones.fields.length - 1}>
              Move down<span className="sr-only"> zone {index + 1}</span>
            </Button>
            <Button variant="quiet" onClick={() => zones.remove(index)} disabled={zones.fields.length === 1}>
              Remove zone {index + 1}
            </Button>
          </div>
        </fieldset>
      ))}
      <Button variant="secondary" onClick={() => zones.append({ code: '', postalPrefixes: [] })}>
        Add a zone
      </Button>
    </FieldGroup>
  );
}

// Flex bases: a zone code needs about 9rem with the select's arrow; a weight or a price fits in 6rem.
const BAND_ZONE_COLUMN = 'sm:flex-[3_1_9rem]';
const BAND_NUMBER_COLUMN = 'sm:flex-[2_1_6rem]';

interface BandsSectionProps {
  currency: string;
  units: UnitSystem;
  money: (minor: number) => string;
  parseMoney: (text: string) => number;
}

function BandsSection({ currency, units, money, parseMoney }: BandsSectionProps) {
  const { control, getValues } = useFormContext<TableValues>();
  const bands = useFieldArray({ control, name: 'bands' });
  return (
    <FieldGroup
      legend="Weight bands"
      description="The price of a parcel up to each weight, per zone. A parcel takes the lightest band of its zone that covers its billable weight."
    >
      <ListError name="bands" />
      {bands.fields.map((field, index) => (
        <fieldset key={field.id} className="space-y-4 rounded-stitch border-2 border-seam p-4">
          <legend className="px-2 font-bold">Band {index + 1}</legend>
          {/* The zone never narrower than a code like "regional"; beside the quote tester the row wraps instead of squeezing it. */}
          <div className="grid items-start gap-4 sm:flex sm:flex-wrap">
            <BandZoneField name={`bands.${index}.zone`} label="Zone" className={BAND_ZONE_COLUMN} />
            <div className={BAND_NUMBER_COLUMN}>
              <NumberField name={`bands.${index}.maxGrams`} label="Up to (grams)" />
              <WeightEcho name={`bands.${index}.maxGrams`} units={units} />
            </div>
            <ScaledNumberField
              name={`bands.${index}.priceMinor`}
              label={`Price (${currency})`}
              toText={money}
              fromText={parseMoney}
              className={BAND_NUMBER_COLUMN}
            />
          </div>
          <Button variant="quiet" onClick={() => bands.remove(index)} disabled={bands.fields.length === 1}>
            Remove band {index + 1}
          </Button>
        </fieldset>
      ))}
      <Button
        variant="secondary"
        onClick={() => {
          const last = getValues('bands').at(-1);
          bands.append({ zone: last?.zone ?? getValues('zones.0.code') ?? '', maxGrams: (last?.maxGrams ?? 0) + 454, priceMinor: last?.priceMinor ?? 0 });
        }}
      >
        Add a band
      </Button>
    </FieldGroup>
  );
}

function PackagingSection({ currency, units }: { currency: string; units: UnitSystem }) {
  const { control } = useFormContext<TableValues>();
  const packaging = useFieldArray({ control, name: 'packaging' });
  return (
    <FieldGroup
      legend="Packaging"
      description="What sellers post in. Each parcel goes in the cheapest package that holds it; sizes are inside measurements in millimetres."
    >
      <ListError name="packaging" />
      {packaging.fields.map((field, index) => (
        <fieldset key={field.id} className="space-y-4 rounded-stitch border-2 border-seam p-4">
          <legend className="px-2 font-bold">Package {index + 1}</legend>
          <div className="grid gap-4 sm:grid-cols-2">
            <TextField name={`packaging.${index}.name`} label="Name" hint="Shown to buyers, like Padded mailer." autoComplete="off" />
            <TextField name={`packaging.${index}.code`} label="Code" hint="Lower-case, like padded_mailer." autoComplete="off" spellCheck={false} />
          </div>
          <div className="grid grid-cols-3 gap-3">
            <NumberField name={`packaging.${index}.innerMm.0`} label="Length (mm)" />
            <NumberField name={`packaging.${index}.innerMm.1`} label="Width (mm)" />
            <NumberField name={`packaging.${index}.innerMm.2`} label="Height (mm)" />
          </div>
          <div className="grid gap-4 sm:grid-cols-3">
            <div>
              <NumberField name={`packaging.${index}.tareGrams`} label="Own weight (grams)" hint="The empty package (tare)." />
              <WeightEcho name={`packaging.${index}.tareGrams`} units={units} />
            </div>
            <div>
              <NumberField name={`packaging.${index}.maxGrams`} label="Holds up to (grams)" hint="Contents and package together." />
              <WeightEcho name={`packaging.${index}.maxGrams`} units={units} />
            </div>
            <OptionalMoneyField
              name={`packaging.${index}.flatPriceMinor`}
              label={`Flat price (${currency})`}
              hint="Leave empty to price by weight band."
              currency={currency}
            />
          </div>
          <Button variant="quiet" onClick={() => packaging.remove(index)} disabled={packaging.fields.length === 1}>
            Remove package {index + 1}
          </Button>
        </fieldset>
      ))}
      <Button
        variant="secondary"
        onClick={() => packaging.append({ code: '', name: '', innerMm: [300, 200, 100], tareGrams: 100, maxGrams: 2000, flatPriceMinor: null })}
      >
        Add a package
      </Button>
    </FieldGroup>
  );
}
