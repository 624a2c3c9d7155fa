import { formatWeight, OFFER_LABELS, OFFERS, type DashboardFigures, type Offer, type UnitSystem } from '@scrap-relay/shared';
import { Bar, BarChart, CartesianGrid, Legend, Line, LineChart, Tooltip, XAxis, YAxis } from 'recharts';
import { chartWeightUnit, formatHours, gramsInChartUnit, reviewTrend, shelfByCut, shelfByValue, weightByMonth } from '../chart-data.ts';
import { ChartFigure, ChartTable } from './chart-figure.tsx';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';

/*
 * Series colours from the app's palette, picked so they also differ in lightness
 * (dark, medium, light, hatched) and stay apart when printed in black and white.
 */
const INK = '#1d2547';
const SEAM = '#d6c9b1';
const OFFER_FILL: Record<Offer, string> = {
  sale: INK,
  postage_only: '#756852',
  meeting: SEAM,
  starter: 'url(#starter-hatch)',
};
const AXIS_TICK = { fill: INK, fontSize: 15 };
const CHART_HEIGHT = 320;

export interface DashboardChartsProps {
  charts: DashboardFigures['charts'];
  units: UnitSystem;
  now?: Date;
}

/** The dashboard's four charts; loaded on its own (React.lazy) so the chart library stays out of other pages. */
export default function DashboardCharts({ charts, units, now = new Date() }: DashboardChartsProps) {
  const timeZone = useGuildTimeZone();
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <WeightChart charts={charts} units={units} now={now} timeZone={timeZone} />
      <ReviewChart charts={charts} now={now} timeZone={timeZone} />
      <ShelfValueChart charts={charts} />
      <ShelfCutChart charts={charts} />
    </div>
  );
}

function WeightChart({ charts, units, now, timeZone }: { charts: DashboardFigures['charts']; units: UnitSystem; now: Date; timeZone: string }) {
  const months = weightByMonth(charts.weightByMonth, now, timeZone);
  const unit = chartWeightUnit(units);
  const data = months.map((m) => ({ label: m.label, ...Object.fromEntries(OFFERS.map((offer) => [offer, gramsInChartUnit(m.grams[offer], units)])) }));
  const total = months.reduce((sum, m) => sum + m.totalGrams, 0);
  const busiest = months.reduce((a, b) => (b.totalGrams > a.totalGrams ? b : a), months[0]!);
  const summary =
    total === 0
      ? 'Nothing was rehomed in the last twelve months.'
      : `${formatWeight(total, units)} rehomed in the last twelve months; the busiest month was ${busiest.label} with ${formatWeight(busiest.totalGrams, units)}.`;
  return (
    <ChartFigure
      title="Weight rehomed per month"
      note={`Last twelve months, in ${unit.label}, stacked by offer.`}
      summary={summary}
      chart={
        <BarChart data={data} responsive width="100%" height={CHART_HEIGHT} accessibilityLayer={false} margin={{ top: 8, right: 8, bottom: 8, left: 0 }}>
          <defs>
            <pattern id="starter-hatch" patternUnits="userSpaceOnUse" width="6" height="6" patternTransform="rotate(45)">
              <rect width="6" height="6" fill="#ffffff" />
              <line x1="0" y1="0" x2="0" y2="6" stroke="#9b2d24" strokeWidth="3" />
            </pattern>
          </defs>
          <CartesianGrid vertical={false} stroke={SEAM} />
          <XAxis dataKey="label" tick={AXIS_TICK} interval="preserveStartEnd" />
          <YAxis tick={AXIS_TICK} unit={` ${unit.label}`} width={72} allowDecimals />
          <Tooltip formatter={(value) => `${String(value)} ${unit.label}`} />
          {/* Legend text in ink, in the offers' own order: the series colours are too light to read as text. */}
          <Legend itemSorter={null} formatter={(value) => <span style={{ color: INK }}>{String(value)}</span>} />
          {OFFERS.map((offer) => (
            <Bar key={offer} dataKey={offer} name={OFFER_LABELS[offer]} stackId="weight" fill={OFFER_FILL[offer]} stroke={INK} strokeWidth={1} isAnimationActive={false} />
          ))}
        </BarChart>
      }
      table={
        <ChartTable
          caption="Weight rehomed per month, by offer"
          columns={['Month', ...OFFERS.map((offer) => OFFER_LABELS[offer]), 'Total']}
          rows={months.map((m) => ({
            key: m.month,
            cells: [m.label, ...OFFERS.map((offer) => formatWeight(m.grams[offer], units)), formatWeight(m.totalGrams, units)],
          }))}
        />
      }
    />
  );
}

function ReviewChart({ charts, now, timeZone }: { charts: DashboardFigures['charts']; now: Date; timeZone: string }) {
  const trend = reviewTrend(charts.reviewHoursByMonth, now, timeZone);
  const known = trend.filter((m): m is typeof m & { medianHours: number } => m.medianHours !== null);
  const latest = known.at(-1);
  const summary = latest
    ? `In ${latest.label} half of all listings were reviewed within ${formatHours(latest.medianHours)}. ${known.length} of the last twelve months had reviews.`
    : 'No listing was reviewed in the last twelve months.';
  return (
    <ChartFigure
      title="Time to review a listing"
      note="Median hours from submitting to the librarian’s decision, per month."
      summary={summary}
      chart={
        <LineChart data={trend} responsive width="100%" height={CHART_HEIGHT} accessibilityLayer={false} margin={{ top: 8, right: 16, bottom: 8, left: 0 }}>
          <CartesianGrid vertical={false} stroke={SEAM} />
          <XAxis dataKey="label" tick={AXIS_TICK} interval="preserveStartEnd" />
          <YAxis tick={AXIS_TICK} unit=" h" width={60} />
          <Tooltip formatter={(value) => (typeof value === 'number' ? formatHours(value) : String(value))} />
          <Line type="monotone" dataKey="medianHours" name="Median review time" stroke={INK} strokeWidth={3} dot={{ r: 4, fill: INK }} isAnimationActive={false} />
        </LineChart>
      }
      table={
        <ChartTable
          caption="Median review time per month"
          columns={['Month', 'Median review time']}
          rows={trend.map((m) => ({ key: m.month, cells: [m.label, m.medianHours === null ? 'No reviews' : formatHours(m.medianHours)] }))}
        />
      }
    />
  );
}

function ShelfValueChart({ charts }: { charts: DashboardFigures['charts'] }) {
  const rows = shelfByValue(charts.shelfByValue);
  const total = rows.reduce((sum, r) => sum + r.bundles, 0);
  return (
    <ChartFigure
      title="On the shelf by colour value"
      note="Bundles on the shelf now."
      summary={total === 0 ? 'The shelf is empty.' : rows.map((r) => `${r.label}: ${r.bundles}`).join('; ') + '.'}
      chart={<CountBars rows={rows} name="Bundles" />}
      table={<ChartTable caption="Bundles on the shelf by colour value" columns={['Colour value', 'Bundles']} rows={rows.map((r) => ({ key: r.key, cells: [r.label, r.bundles] }))} />}
    />
  );
}

function ShelfCutChart({ charts }: { charts: DashboardFigures['charts'] }) {
  const rows = shelfByCut(charts.shelfByCut);
  return (
    <ChartFigure
      title="On the shelf by cut"
      note="Bundles on the shelf now; a bundle with several kinds of cut counts under each."
      summary={rows.length === 0 ? 'The shelf is empty.' : rows.map((r) => `${r.label}: ${r.bundles}`).join('; ') + '.'}
      chart={<CountBars rows={rows} name="Bundles" layout="vertical" />}
      table={<ChartTable caption="Bundles on the shelf by cut kind" columns={['Cut kind', 'Bundles']} rows={rows.map((r) => ({ key: r.key, cells: [r.label, r.bundles] }))} />}
    />
  );
}

/** Bars of bundle counts; horizontal when the labels are long (cut kinds). */
function CountBars({ rows, name, layout = 'horizontal' }: { rows: { label: string; bundles: number }[]; name: string; layout?: 'horizontal' | 'vertical' }) {
  if (rows.length === 0) return <p className="py-6 text-thread-soft">No bundles on the shelf right now.</p>;
  const vertical = layout === 'vertical';
  const height = vertical ? Math.max(160, rows.length * 44 + 40) : CHART_HEIGHT;
  return (
    <BarChart data={rows} layout={layout} responsive width="100%" height={height} accessibilityLayer={false} margin={{ top: 8, right: 16, bottom: 8, left: 0 }}>
      <CartesianGrid horizontal={!vertical} vertical={vertical} stroke={SEAM} />
      {vertical ? (
        <>
          <XAxis type="number" tick={AXIS_TICK} allowDecimals={false} />
          <YAxis type="category" dataKey="label" tick={AXIS_TICK} width={170} />
        </>
      ) : (
        <>
          <XAxis dataKey="label" tick={AXIS_TICK} />
          <YAxis tick={AXIS_TICK} allowDecimals={false} width={48} />
        </>
      )}
      <Tooltip />
      <Bar dataKey="bundles" name={name} fill={INK} isAnimationActive={false} />
    </BarChart>
  );
}
