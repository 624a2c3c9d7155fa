import { dashboardQuerySchema, type DashboardQuery } from '@scrap-relay/shared';
import { useState } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { FieldShell, Input, Select } from '../../../components/ui/field.tsx';
import { PERIOD_LABELS, type Period } from '../period.ts';

const OPTIONS = (Object.keys(PERIOD_LABELS) as Period[]).map((value) => ({ value, label: PERIOD_LABELS[value] }));

/**
 * Which period the figures cover. Month, year and all time apply at once; two dates
 * apply with a button, checked by the API's own query schema first.
 */
export function PeriodPicker({ value, onChange }: { value: DashboardQuery; onChange: (query: DashboardQuery) => void }) {
  const [period, setPeriod] = useState<Period>(value.period);
  const [from, setFrom] = useState(value.from ?? '');
  const [to, setTo] = useState(value.to ?? '');
  const [errors, setErrors] = useState<{ from?: string; to?: string }>({});

  const choose = (next: Period) => {
    setPeriod(next);
    setErrors({});
    if (next !== 'custom') onChange({ period: next });
  };

  const applyDates = () => {
    const parsed = dashboardQuerySchema.safeParse({ period: 'custom', from: from || undefined, to: to || undefined });
    if (!parsed.success) {
      const found: { from?: string; to?: string } = {};
      for (const issue of parsed.error.issues) {
        const field = issue.path[0];
        if ((field === 'from' || field === 'to') && !found[field]) found[field] = issue.message;
      }
      setErrors(found);
      return;
    }
    setErrors({});
    onChange(parsed.data);
  };

  return (
    <div className="flex w-full flex-wrap items-end gap-4 rounded-stitch border-2 border-seam bg-muslin p-4 sm:w-auto print:hidden">
      <FieldShell label="Period" className="w-full sm:w-56">
        {(control) => <Select {...control} options={OPTIONS} value={period} onChange={(event) => choose(event.target.value as Period)} />}
      </FieldShell>
      {period === 'custom' ? (
        <>
          <FieldShell label="From" error={errors.from} className="w-full sm:w-48">
            {(control) => <Input {...control} type="date" value={from} onChange={(event) => setFrom(event.target.value)} />}
          </FieldShell>
          <FieldShell label="To (included)" error={errors.to} className="w-full sm:w-48">
            {(control) => <Input {...control} type="date" value={to} onChange={(event) => setTo(event.target.value)} />}
          </FieldShell>
          <Button onClick={applyDates}>Show these dates</Button>
        </>
      ) : null}
    </div>
  );
}
