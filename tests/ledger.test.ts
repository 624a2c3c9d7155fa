import { processingCostEntries } from '@scrap-relay/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Guild, LedgerEntry } from '../apps/api/src/db/models/index.ts';
import { writeLedger } from '../apps/api/src/modules/orders/ledger-writer.ts';
import { createMember, signedInClient, startTestApi, type Client, type TestApi } from './support/api.ts';

let api: TestApi;
let treasurerClient: Client;

beforeAll(async () => {
  api = await startTestApi();
  treasurerClient = await signedInClient(api.runtime.app, await createMember({ roles: ['member', 'treasurer'] }));
});
afterAll(async () => {
  await api.close();
});

/**
 * Pacific/Auckland keeps New Zealand daylight time, UTC+13, from 28 September 2025 to 5 April 2026 (IANA tz
 * database), so November 2025 there runs from 11:00 UTC on 31 October to 11:00 UTC on 30 November. One entry a
 * second either side of each of those midnights.
 */
const EDGES = {
  lastOfOctober: '2025-10-31T10:59:59.000Z',
  firstOfNovember: '2025-10-31T11:00:00.000Z',
  lastOfNovember: '2025-11-30T10:59:59.000Z',
  firstOfDecember: '2025-11-30T11:00:00.000Z',
} as const;
type Edge = keyof typeof EDGES;

/** Writes one small balanced transaction at each edge, as the app writes any, and gives each edge its transaction. */
async function entriesAtTheEdges(): Promise<Record<Edge, string>> {
  const transactions = {} as Record<Edge, string>;
  for (const [edge, at] of Object.entries(EDGES) as [Edge, string][]) {
    await api.runtime.ctx.sequelize.transaction((transaction) => writeLedger(processingCostEntries(37), { currency: 'USD', at: new Date(at) }, transaction));
    const written = await LedgerEntry.findAll({ where: { createdAt: new Date(at), kind: 'processing_cost' } });
    expect(new Set(written.map((e) => e.transactionId)).size).toBe(1);
    transactions[edge] = written[0]!.transactionId;
  }
  return transactions;
}

async function withGuildZone(timeZone: string, run: () => Promise<void>) {
  const guild = (await Guild.findByPk(1))!;
  const settings = guild.settings;
  await guild.update({ settings: { ...settings, timeZone } });
  try {
    await run();
  } finally {
    await guild.update({ settings });
  }
}

/** Which of the edges' transactions the ledger shows for those days. */
async function edgesShown(transactions: Record<Edge, string>, query: string): Promise<Edge[]> {
  const res = await treasurerClient.get(`/api/ledger?${query}`);
  expect(res.status).toBe(200);
  const shown = new Set(res.body.items.map((e: { transactionId: string }) => e.transactionId));
  return (Object.keys(transactions) as Edge[]).filter((edge) => shown.has(transactions[edge]));
}

describe('the ledger’s dates are the guild’s days', () => {
  it('reads 1 to 30 November as November in the guild’s time zone, across midnight at both ends, and the CSV says whose clock it is', async () => {
    const transactions = await entriesAtTheEdges();
    const november = 'from=2025-11-01&to=2025-11-30&kind=processing_cost';

    await withGuildZone('Pacific/Auckland', async () => {
      expect(await edgesShown(transactions, november)).toEqual(['firstOfNovember', 'lastOfNovember']);
      // One day alone: 30 November ends at midnight in Auckland, not in UTC.
      expect(await edgesShown(transactions, 'from=2025-11-30&to=2025-11-30')).toEqual(['lastOfNovember']);
      expect(await edgesShown(transactions, 'from=2025-12-01')).toEqual(['firstOfDecember']);
      expect(await edgesShown(transactions, 'to=2025-10-31')).toEqual(['lastOfOctober']);

      const csv = await treasurerClient.get(`/api/ledger.csv?${november}`);
      expect(csv.status).toBe(200);
      const lines = csv.text.trim().split('\n');
      expect(lines[0]).toBe('time_in_Pacific/Auckland,transaction,kind,reverses,account,amount_in_currency_units,currency,order,payout');
      const timeOf = (edge: Edge) => lines.find((line) => line.split(',')[1] === transactions[edge])?.split(',')[0];
      expect(timeOf('firstOfNovember')).toBe('2025-11-01 00:00:00');
      expect(timeOf('lastOfNovember')).toBe('2025-11-30 23:59:59');
      expect(timeOf('lastOfOctober')).toBeUndefined();
      expect(timeOf('firstOfDecember')).toBeUndefined();
    });

    // The same entries for a guild on UTC: November is UTC's, and the edges fall the other way.
    await withGuildZone('UTC', async () => {
      expect(await edgesShown(transactions, november)).toEqual(['lastOfNovember', 'firstOfDecember']);
      const csv = await treasurerClient.get(`/api/ledger.csv?${november}`);
      expect(csv.text.split('\n')[0]).toMatch(/^time_in_UTC,/);
      expect(csv.text).toContain(`2025-11-30 11:00:00,${transactions.firstOfDecember},`);
    });
  });

  it('refuses a day that is not a date with a 400 naming the field', async () => {
    const res = await treasurerClient.get('/api/ledger?from=2025-11-31');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['from']);
  });
});
