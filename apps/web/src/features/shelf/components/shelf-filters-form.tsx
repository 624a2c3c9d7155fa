import {
  COLOUR_FAMILIES,
  COLOUR_FAMILY_LABELS,
  COLOUR_VALUES,
  COLOUR_VALUE_LABELS,
  CUT_KINDS,
  CUT_KIND_LABELS,
  CUT_SIZES,
  CUT_SIZE_LABELS,
  FIBRES,
  FIBRE_LABELS,
  OFFER_LABELS,
  SHELF_OFFERS,
  type ShelfFilters,
  type UnitSystem,
} from '@scrap-relay/shared';
import { useEffect, useId, useMemo } from 'react';
import { useFormContext } from 'react-hook-form';
import { Button } from '../../../components/ui/button.tsx';
import { Form, SelectField, SubmitButton, TextField } from '../../../components/ui/form.tsx';
import { bareWeightNote } from '../../../utils/weight-text.ts';
import { filterFormSchema, filterFormValues, weightExample, type FilterFormValues } from '../utils/filter-form.ts';

const choices = <T extends string>(any: string, values: readonly T[], labels: Readonly<Record<T, string>>) => [
  { value: '', label: any },
  ...values.map((value) => ({ value, label: labels[value] })),
];

const offerOptions = choices('Any offer', SHELF_OFFERS, OFFER_LABELS);
const cutOptions = choices('Any cut', CUT_KINDS, CUT_KIND_LABELS);
const sizeOptions = choices('Any size', CUT_SIZES, CUT_SIZE_LABELS);
const valueOptions = choices('Any value', COLOUR_VALUES, COLOUR_VALUE_LABELS);
const familyOptions = choices('Any colour family', COLOUR_FAMILIES, COLOUR_FAMILY_LABELS);
const fibreOptions = choices('Any fibre', FIBRES, FIBRE_LABELS);

export interface ShelfFiltersFormProps {
  filters: ShelfFilters;
  units: UnitSystem;
  currency: string;
  onApply: (filters: ShelfFilters) => void;
  onClear: () => void;
}

/** Every shelf filter in one form, applied together with one button (a keyboard walk through a menu does not reload the shelf at each step). */
export function ShelfFiltersForm({ filters, units, currency, onApply, onClear }: ShelfFiltersFormProps) {
  const schema = useMemo(() => filterFormSchema({ units, currency, current: filters }), [units, currency, filters]);
  const values = useMemo(() => filterFormValues(filters, { units, currency }), [filters, units, currency]);
  const weightHintId = useId();
  const weightHint = `${weightExample(units)}. ${bareWeightNote(units)}`;

  return (
    <Form<FilterFormValues, ShelfFilters> schema={schema} defaultValues={values} onSubmit={(chosen) => onApply(chosen)} className="space-y-5">
      <FollowAddress values={values} />
      <TextField name="q" label="Words in the title or description" type="search" autoComplete="off" enterKeyHint="search" />
      <SelectField name="offer" label="Offer" options={offerOptions} />
      <SelectField name="cut" label="Cut" options={cutOptions} />
      <SelectField name="size" label="Strip width or square size" options={sizeOptions} />
      <SelectField name="fibre" label="Fibre" options={fibreOptions} />
      <SelectField name="value" label="Colour value" options={valueOptions} />
      <SelectField name="family" label="Colour family" options={familyOptions} />
      {/* The example is the group's description, so it is read on entering either box. */}
      <fieldset className="space-y-3" aria-describedby={weightHintId}>
        <legend className="font-bold">Weight</legend>
        <p id={weightHintId} className="text-thread-soft">
          {weightHint}
        </p>
        <div className="grid grid-cols-2 gap-3">
          <TextField name="minWeight" label="At least" inputMode="text" autoComplete="off" />
          <TextField name="maxWeight" label="At most" inputMode="text" autoComplete="off" />
        </div>
      </fieldset>
      <TextField
        name="maxPrice"
        label={`Highest price (${currency})`}
        hint="Free bundles show whatever the limit."
        inputMode="decimal"
        autoComplete="off"
        className="[&_input]:max-w-40"
      />
      <div className="flex flex-wrap gap-3">
        <SubmitButton>Show bundles</SubmitButton>
        <Button variant="quiet" onClick={onClear}>
          Clear filters
        </Button>
      </div>
    </Form>
  );
}

/** When the address changes underneath the form (back button, a shared link, "clear"), show what it now says. */
function FollowAddress({ values }: { values: FilterFormValues }) {
  const { reset } = useFormContext<FilterFormValues>();
  useEffect(() => reset(values), [reset, values]);
  return null;
}
