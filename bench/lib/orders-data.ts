/**
 * Fills the bench database with 18 months of an invented guild's trade:
 * 50 000 orders between the shelf benchmark's invented members (loadShelf
 * must have run), each with its rehomed bundles, order lines, and the ledger
 * entries a paid order writes (apps/api/src/modules/orders/orders.service.ts,
 * ledgerEntriesForPaidOrder and reversalEntries in packages/shared money.ts);
 * some cancelled, some refunded; and each month's seller credits paid out by
 * an invented treasurer early the next month. Set-based SQL throughout: a
 * handful of INSERT … SELECT statements over generate_series, in seconds.
 */
import pg from 'pg';
import { CUT_KINDS, FIBRES, ledgerEntriesForPaidOrder, orderMoney, reversalEntries, type LedgerEntry } from '@scrap-relay/shared';
import { hashPassword } from '../../apps/api/src/auth/passwords.ts';
import { DEFAULT_GUILD_SETTINGS, type GuildSettingsDocument } from '../../apps/api/src/db/models/index.ts';
import { SHELF_SELLERS, benchSellerEmail } from './shelf-data.ts';

export const ORDERS = 50_000;
export const MONTHS = 18;

/** The invented treasurer who records payouts and reads the dashboard in the benchmark. */
export const BENCH_TREASURER = { name: 'Marguerite Pellow', email: 'treasurer@dashboard-bench.example', password: 'dashboard-bench-treasurer' } as const;

const MEMBER_DOMAIN = benchSellerEmail(1).split('@')[1]!;

/** The triggers of migration 20261202120000-office-tallies.ts on the tables this loader fills. */
const OFFICE_TALLY_TRIGGERS = [
  ['bundles', 'bundles_office_tally_insert'],
  ['bundles', 'bundles_office_tally_update'],
  ['orders', 'orders_office_tally_insert'],
  ['orders', 'orders_office_tally_update'],
  ['order_items', 'order_items_office_tally'],
  ['ledger_entries', 'ledger_entries_office_tally'],
] as const;

export interface OrdersLoad {
  /** False when the database already held the orders. */
  loaded: boolean;
  seconds: number;
  orders: number;
  orderItems: number;
  ledgerEntries: number;
  payouts: number;
  refundedOrPaidThenCancelled: number;
}

/** Adds the treasurer (idempotent) and returns their id. One argon2 hash, made here so no hash is stored in the code. */
export async function ensureBenchTreasurer(client: pg.Client): Promise<string> {
  const existing = await client.query<{ id: string }>('SELECT id FROM members WHERE lower(email) = lower($1)', [BENCH_TREASURER.email]);
  if (existing.rows[0] !== undefined) return existing.rows[0].id;
  const inserted = await client.query<{ id: string }>(
    `INSERT INTO members (name, email, password_hash, roles, joined_at, email_verified_at)
     VALUES ($1, $2, $3, ARRAY['member', 'treasurer'], now() - interval '6 years', now() - interval '6 years')
     RETURNING id`,
    [BENCH_TREASURER.name, BENCH_TREASURER.email, await hashPassword(BENCH_TREASURER.password)],
  );
  return inserted.rows[0]!.id;
}

async function counts(client: pg.Client): Promise<Omit<OrdersLoad, 'loaded' | 'seconds'>> {
  const { rows } = await client.query<Omit<OrdersLoad, 'loaded' | 'seconds'>>(
    `SELECT (SELECT count(*) FROM orders o JOIN members m ON m.id = o.buyer_id WHERE m.email LIKE '%@' || $1::text)::int AS "orders",
            (SELECT count(*) FROM order_items)::int AS "orderItems",
            (SELECT count(*) FROM ledger_entries)::int AS "ledgerEntries",
            (SELECT count(*) FROM payouts)::int AS "payouts",
            (SELECT count(*) FROM orders WHERE refunded_at IS NOT NULL)::int AS "refundedOrPaidThenCancelled"`,
    [MEMBER_DOMAIN],
  );
  return rows[0]!;
}

/**
 * Checks the loaded rows against the domain code rather than trusting the SQL
 * above: every ledger transaction sums to zero, and a sample of orders has the
 * money and the ledger entries orderMoney / ledgerEntriesForPaidOrder /
 * reversalEntries give for the same lines.
 */
async function verify(client: pg.Client, settings: GuildSettingsDocument): Promise<void> {
  const unbalanced = await client.query<{ n: number }>(
    'SELECT count(*)::int AS n FROM (SELECT transaction_id FROM ledger_entries GROUP BY transaction_id HAVING sum(amount_minor) <> 0) t',
  );
  if (unbalanced.rows[0]!.n !== 0) throw new Error(`${unbalanced.rows[0]!.n} ledger transactions do not sum to zero.`);

  const sample = await client.query<{
    id: string;
    seller_id: string;
    state: string;
    paid: boolean;
    refunded: boolean;
    subtotal_minor: number;
    postage_minor: number;
    charge_minor: number;
    guild_fee_minor: number;
    processing_cost_minor: number;
    seller_credit_minor: number;
    lines: { priceMinor: number; quantity: number }[];
    entries: { kind: LedgerEntry['kind']; account: string; amount: number; reverses: string | null }[] | null;
  }>(
    `SELECT o.id, o.seller_id, o.state, o.paid_at IS NOT NULL AS paid, o.refunded_at IS NOT NULL AS refunded,
            o.subtotal_minor, o.postage_minor, o.charge_minor, o.guild_fee_minor, o.processing_cost_minor, o.seller_credit_minor,
            (SELECT json_agg(json_build_object('priceMinor', i.unit_price_minor, 'quantity', i.quantity)) FROM order_items i WHERE i.order_id = o.id) AS lines,
            (SELECT json_agg(json_build_object('kind', e.kind, 'account', e.account, 'amount', e.amount_minor, 'reverses', e.reverses) ORDER BY e.id)
               FROM ledger_entries e WHERE e.order_id = o.id) AS entries
     FROM orders o TABLESAMPLE BERNOULLI (1) REPEATABLE (7)
     JOIN members m ON m.id = o.buyer_id WHERE m.email LIKE '%@' || $1::text
     LIMIT 300`,
    [MEMBER_DOMAIN],
  );
  const key = (e: { kind: string; account: string; amountMinor: number; reverses?: string | null }) => `${e.kind}/${e.reverses ?? ''}/${e.account}/${e.amountMinor}`;
  for (const row of sample.rows) {
    const money = orderMoney({
      lines: row.lines,
      postageMinor: row.postage_minor,
      guildFeeBasisPoints: settings.guildFeeBasisPoints,
      processing: { percentBasisPoints: settings.processingPercentBasisPoints, fixedMinor: settings.processingFixedMinor },
    });
    const needsPayment = money.chargeMinor > 0;
    const stored = [row.subtotal_minor, row.postage_minor, row.charge_minor, row.guild_fee_minor, row.processing_cost_minor, row.seller_credit_minor];
    const expected = [money.subtotalMinor, money.postageMinor, money.chargeMinor, money.guildFeeMinor, needsPayment ? money.processingCostMinor : 0, money.sellerCreditMinor];
    if (stored.join() !== expected.join()) throw new Error(`Order ${row.id}: stored money ${stored.join()} is not orderMoney's ${expected.join()}.`);

    const paidEntries = row.paid && needsPayment ? ledgerEntriesForPaidOrder({ sellerId: row.seller_id, money }) : [];
    const wanted = [...paidEntries, ...(row.refunded ? reversalEntries(paidEntries) : [])].map(key).sort();
    const found = (row.entries ?? []).map((e) => key({ kind: e.kind, account: e.account, amountMinor: e.amount, reverses: e.reverses })).sort();
    if (wanted.join() !== found.join()) throw new Error(`Order ${row.id} (${row.state}): ledger entries ${found.join(' ')} are not ${wanted.join(' ')}.`);
  }
  if (sample.rows.length < 100) throw new Error(`Only ${sample.rows.length} orders were sampled for checking.`);

  // The dashboard reads office_tallies: they must be what the base tables give.
  const differences = await client.query<{ n: number }>(
    `WITH kept AS (SELECT grain, day, figure, key, sum(amount)::bigint AS amount FROM office_tallies GROUP BY 1, 2, 3, 4 HAVING sum(amount) <> 0),
          fresh AS (SELECT * FROM office_tallies_expected())
     SELECT ((SELECT count(*) FROM (SELECT * FROM kept EXCEPT SELECT * FROM fresh) a) + (SELECT count(*) FROM (SELECT * FROM fresh EXCEPT SELECT * FROM kept) b))::int AS n`,
  );
  if (differences.rows[0]!.n !== 0) throw new Error(`${differences.rows[0]!.n} office tallies differ from a recomputation from the base tables.`);
}

/**
 * Loads the orders unless they are there already. Money follows the guild's
 * own settings (fee and processing rates), rounded half up once per order as
 * money.ts does; the sample check in verify() holds the SQL to that.
 */
export async function loadOrders(databaseUrl: string): Promise<OrdersLoad> {
  const started = Date.now();
  const client = new pg.Client({ connectionString: databaseUrl, application_name: 'scrap-relay-bench-orders' });
  await client.connect();
  try {
    const members = await client.query<{ n: number }>(`SELECT count(*)::int AS n FROM members WHERE email LIKE '%@' || $1::text`, [MEMBER_DOMAIN]);
    if (members.rows[0]!.n !== SHELF_SELLERS) throw new Error(`loadOrders needs loadShelf's ${SHELF_SELLERS} invented members; found ${members.rows[0]!.n}.`);
    const guild = await client.query<{ currency: string; settings: Partial<GuildSettingsDocument> }>('SELECT currency, settings FROM guild WHERE id = 1');
    if (guild.rows[0] === undefined) throw new Error('The bench database has no guild row.');
    const currency = guild.rows[0].currency.trim();
    const settings = { ...DEFAULT_GUILD_SETTINGS, ...guild.rows[0].settings };
    const treasurerId = await ensureBenchTreasurer(client);

    const already = await counts(client);
    if (already.orders >= ORDERS) return { loaded: false, seconds: (Date.now() - started) / 1000, ...already };
    if (already.orders > 0) throw new Error(`The bench database holds ${already.orders} invented orders, fewer than ${ORDERS}; recreate it.`);

    await client.query('BEGIN');
    // The guild office's tally triggers would add about a millisecond per loaded row; they are
    // switched off for this bulk load and the tallies rebuilt once from the loaded rows at the end
    // (verify() then holds them to a recomputation). The integration tests check the triggers.
    for (const [table, trigger] of OFFICE_TALLY_TRIGGERS) await client.query(`ALTER TABLE ${table} DISABLE TRIGGER ${trigger}`);
    // A fixed seed: every run loads the same trade, so figures from different runs compare.
    await client.query('SELECT setseed(0.1812)');

    // One meeting on the 10th of every month in the span (and the next), where meeting orders change hands.
    await client.query(
      `CREATE TEMP TABLE bench_meetings ON COMMIT DROP AS
       SELECT gen_random_uuid() AS id, date_trunc('month', now()) - k * interval '1 month' + interval '9 days 19 hours' AS starts_at
       FROM generate_series(-1, $1::int) AS k`,
      [MONTHS + 1],
    );
    await client.query(
      `INSERT INTO meetings (id, starts_at, place, notes, created_by, created_at, updated_at)
       SELECT id, starts_at, 'Ferncombe Guild Hall, back room', 'Monthly guild meeting', $1, starts_at - interval '60 days', starts_at - interval '60 days'
       FROM bench_meetings`,
      [treasurerId],
    );

    // Orders: who, what kind, when, and how each ended (fate), all drawn once per order.
    await client.query(
      `CREATE TEMP TABLE bench_orders ON COMMIT DROP AS
       WITH people AS (
         SELECT id, name, row_number() OVER (ORDER BY email)::int AS n FROM members WHERE email LIKE '%@' || $1::text
       ),
       draws AS (
         SELECT i, random() AS r_seller, random() AS r_buyer, random() AS r_kind, random() AS r_lines, random() AS r_age, random() AS r_fate
         FROM generate_series(1, $2::int) AS i
       ),
       shaped AS (
         SELECT d.*,
                -- Some sellers are far busier than others, as on the shelf.
                1 + floor(power(r_seller, 1.6) * $3::int)::int AS seller_n,
                CASE WHEN r_kind < 0.60 THEN 'sale_post' WHEN r_kind < 0.70 THEN 'sale_meeting' WHEN r_kind < 0.88 THEN 'postage_only' ELSE 'meeting_free' END AS kind,
                CASE WHEN r_lines < 0.70 THEN 1 WHEN r_lines < 0.92 THEN 2 ELSE 3 END AS lines,
                now() - r_age * (now() - (now() - $4::int * interval '1 month')) - i * interval '1 millisecond' AS created_at
         FROM draws d
       )
       SELECT s.i, gen_random_uuid() AS id, seller.id AS seller_id, buyer.id AS buyer_id, buyer.name AS buyer_name,
              s.kind, s.lines, s.created_at, s.r_fate,
              CASE WHEN s.kind IN ('sale_post', 'postage_only') THEN 'post' ELSE 'meeting' END AS fulfilment,
              s.kind <> 'meeting_free' AS needs_payment,
              gen_random_uuid() AS paid_transaction, gen_random_uuid() AS refund_transaction
       FROM shaped s
       JOIN people seller ON seller.n = s.seller_n
       -- Any member but the seller: an offset of 1 … n-1 places round the circle.
       JOIN people buyer ON buyer.n = 1 + (s.seller_n + floor(s.r_buyer * ($3::int - 1))::int) % $3::int`,
      [MEMBER_DOMAIN, ORDERS, SHELF_SELLERS, MONTHS],
    );

    // Each order's lines: one rehomed bundle per line, offered the way the order's kind needs.
    await client.query(
      `CREATE TEMP TABLE bench_lines ON COMMIT DROP AS
       SELECT o.id AS order_id, o.seller_id, o.created_at, o.kind, line, gen_random_uuid() AS bundle_id,
              CASE o.kind WHEN 'postage_only' THEN 'postage_only' WHEN 'meeting_free' THEN 'meeting' ELSE 'sale' END AS offer,
              CASE WHEN o.kind LIKE 'sale%' THEN (12 + floor(random() * 148)::int) * 25 ELSE 0 END AS unit_price_minor,
              CASE WHEN random() < 0.9 THEN 1 ELSE 2 + floor(random() * 2)::int END AS quantity,
              100 + floor(power(random(), 1.6) * 2900)::int AS weight_grams,
              ($1::text[])[1 + floor(random() * cardinality($1::text[]))::int] AS fibre,
              ($2::text[])[1 + floor(random() * cardinality($2::text[]))::int] AS cut,
              (ARRAY['light', 'medium', 'dark', 'mixed'])[1 + floor(random() * 4)::int] AS colour_value,
              (ARRAY['warm', 'cool', 'neutral', 'black_white', 'multi'])[1 + floor(random() * 5)::int] AS colour_family,
              random() * 72 AS review_hours
       FROM bench_orders o CROSS JOIN LATERAL generate_series(1, o.lines) AS line`,
      [FIBRES, CUT_KINDS],
    );

    // Money per order by the guild's rules: fee on the subtotal only, processing on the charge, each rounded half up once.
    await client.query(
      `CREATE TEMP TABLE bench_money ON COMMIT DROP AS
       WITH totals AS (
         SELECT order_id, sum(unit_price_minor * quantity)::int AS subtotal, sum(weight_grams * quantity)::int AS grams FROM bench_lines GROUP BY order_id
       ),
       priced AS (
         SELECT o.*, t.subtotal,
                -- A postage table in miniature: a base rate and a step per started 500 g.
                CASE WHEN o.fulfilment = 'post' THEN 475 + 160 * ceil(t.grams / 500.0)::int ELSE 0 END AS postage
         FROM bench_orders o JOIN totals t ON t.order_id = o.id
       ),
       charged AS (
         SELECT p.*, p.subtotal + p.postage AS charge,
                ((2::bigint * p.subtotal * $1::int + 10000) / 20000)::int AS fee
         FROM priced p
       ),
       costed AS (
         SELECT c.*,
                CASE WHEN c.charge = 0 THEN 0 ELSE ((2::bigint * (c.charge::bigint * $2::int + $3::bigint * 10000) + 10000) / 20000)::int END AS processing,
                c.subtotal - c.fee + c.postage AS credit,
                (SELECT m.id FROM bench_meetings m WHERE m.starts_at > c.created_at + interval '1 day' ORDER BY m.starts_at LIMIT 1) AS meeting_id
         FROM charged c
       )
       SELECT c.*, m.starts_at AS meeting_at,
              -- How it ended: 3 % never paid (hold lapsed), 2 % paid then cancelled, 3 % refunded later; the rest ran their course.
              CASE WHEN c.needs_payment AND c.r_fate < 0.03 THEN 'unpaid_cancelled'
                   WHEN c.needs_payment AND c.r_fate < 0.05 THEN 'paid_cancelled'
                   WHEN c.needs_payment AND c.r_fate < 0.08 THEN 'refunded'
                   WHEN NOT c.needs_payment AND c.r_fate < 0.04 THEN 'free_cancelled'
                   ELSE 'completed' END AS fate,
              c.created_at + CASE WHEN c.needs_payment THEN interval '4 minutes' ELSE interval '0' END AS paid_at_if_paid
       FROM costed c LEFT JOIN bench_meetings m ON m.id = c.meeting_id`,
      [settings.guildFeeBasisPoints, settings.processingPercentBasisPoints, settings.processingFixedMinor],
    );

    await client.query(
      `INSERT INTO bundles (id, seller_id, state, title, description, offer, price_minor, currency, meeting_handover_ok,
                            quantity, quantity_available, weight_grams, fibre, cut_kinds, colour_value, colour_family,
                            submitted_at, reviewed_at, on_shelf_at, expires_at, created_at, updated_at)
       SELECT l.bundle_id, l.seller_id,
              CASE WHEN m.fate IN ('unpaid_cancelled', 'paid_cancelled', 'free_cancelled') THEN 'withdrawn' ELSE 'rehomed' END,
              initcap(replace(l.colour_value, '_', ' ')) || ' ' || replace(l.fibre, '_', ' ') || ', ' || replace(l.cut, '_', ' '),
              'Left over from a finished quilt. Pins and needles removed.',
              l.offer, NULLIF(l.unit_price_minor, 0), $1, l.kind = 'sale_meeting',
              l.quantity, CASE WHEN m.fate IN ('unpaid_cancelled', 'paid_cancelled', 'free_cancelled') THEN l.quantity ELSE 0 END,
              l.weight_grams, l.fibre, ARRAY[l.cut], l.colour_value, l.colour_family,
              l.created_at - interval '20 days' - l.review_hours * interval '1 hour',
              l.created_at - interval '20 days',
              l.created_at - interval '20 days',
              l.created_at + interval '70 days',
              l.created_at - interval '21 days' - l.review_hours * interval '1 hour',
              l.created_at
       FROM bench_lines l JOIN bench_money m ON m.id = l.order_id`,
      [currency],
    );

    await client.query(
      `INSERT INTO orders (id, reference, buyer_id, seller_id, state, fulfilment, meeting_id, address, currency,
                           subtotal_minor, postage_minor, charge_minor, guild_fee_minor, processing_cost_minor, seller_credit_minor,
                           stripe_session_id, stripe_payment_intent_id, paid_at, posted_at, received_at, handed_over_at,
                           cancelled_at, cancel_reason, refunded_at, created_at, updated_at)
       SELECT m.id,
              -- SR- and six letters or digits without 0/O/1/I, as newOrderReference makes; an odd multiplier keeps them unique.
              'SR-' || (SELECT string_agg(substr('ABCDEFGHJKLMNPQRSTUVWXYZ23456789', 1 + ((m.i::bigint * 387420489) % 1073741824 >> (5 * k))::int % 32, 1), '' ORDER BY k)
                        FROM generate_series(0, 5) AS k),
              m.buyer_id, m.seller_id,
              CASE m.fate
                WHEN 'unpaid_cancelled' THEN 'cancelled' WHEN 'paid_cancelled' THEN 'cancelled' WHEN 'free_cancelled' THEN 'cancelled'
                WHEN 'refunded' THEN 'refunded'
                ELSE CASE WHEN m.fulfilment = 'meeting' THEN CASE WHEN m.meeting_at < now() THEN 'handed_over' ELSE 'confirmed' END
                          WHEN m.created_at > now() - interval '2 days' THEN 'confirmed'
                          WHEN m.created_at > now() - interval '9 days' THEN 'posted'
                          ELSE 'received' END
              END,
              m.fulfilment, CASE WHEN m.fulfilment = 'meeting' THEN m.meeting_id END,
              CASE WHEN m.fulfilment = 'post'
                   THEN jsonb_build_object('name', m.buyer_name, 'line1', (1 + m.i % 97) || ' Bobbin Lane', 'line2', '', 'town', 'Ferncombe',
                                           'region', '', 'postalCode', lpad((10000 + m.i % 89999)::text, 5, '0'), 'country', 'US') END,
              $1, m.subtotal, m.postage, m.charge, m.fee, CASE WHEN m.needs_payment THEN m.processing ELSE 0 END, m.credit,
              CASE WHEN m.needs_payment THEN 'cs_test_bench_' || m.i END,
              CASE WHEN m.needs_payment AND m.fate <> 'unpaid_cancelled' THEN 'pi_test_bench_' || m.i END,
              -- A free order counts as paid when it is made, as createOrder records it.
              CASE WHEN m.fate <> 'unpaid_cancelled' THEN m.paid_at_if_paid END,
              CASE WHEN m.fulfilment = 'post' AND m.fate IN ('completed', 'refunded') AND m.created_at <= now() - interval '2 days' THEN m.created_at + interval '1 day' END,
              CASE WHEN m.fulfilment = 'post' AND m.fate IN ('completed', 'refunded') AND m.created_at <= now() - interval '9 days' THEN m.created_at + interval '5 days' END,
              CASE WHEN m.fulfilment = 'meeting' AND m.fate = 'completed' AND m.meeting_at < now() THEN m.meeting_at + interval '20 minutes' END,
              CASE WHEN m.fate = 'unpaid_cancelled' THEN m.created_at + interval '30 minutes'
                   WHEN m.fate IN ('paid_cancelled', 'free_cancelled') THEN m.created_at + interval '1 day' END,
              CASE m.fate WHEN 'unpaid_cancelled' THEN 'The hold ended before payment.' WHEN 'paid_cancelled' THEN 'Cancelled by the seller before posting.'
                          WHEN 'free_cancelled' THEN 'Cannot come to the meeting.' END,
              CASE WHEN m.fate = 'paid_cancelled' THEN m.created_at + interval '1 day'
                   WHEN m.fate = 'refunded' THEN m.created_at + interval '12 days' END,
              m.created_at, m.created_at
       FROM bench_money m`,
      [currency],
    );

    await client.query(
      `INSERT INTO order_items (order_id, bundle_id, quantity, unit_price_minor, title, weight_grams)
       SELECT l.order_id, l.bundle_id, l.quantity, l.unit_price_minor, b.title, l.weight_grams
       FROM bench_lines l JOIN bundles b ON b.id = l.bundle_id`,
    );

    // What confirmPayment writes for a paid order (zero amounts left out), dated when it was paid.
    await client.query(
      `INSERT INTO ledger_entries (transaction_id, order_id, kind, reverses, account, amount_minor, currency, created_at)
       SELECT m.paid_transaction, o.id, e.kind, NULL, e.account, e.amount, $1, o.paid_at
       FROM bench_money m JOIN orders o ON o.id = m.id
       CROSS JOIN LATERAL (VALUES ('charge', 'buyer', -m.charge), ('seller_credit', 'seller:' || m.seller_id, m.credit),
                                  ('guild_fee', 'guild', m.fee), ('processing_cost', 'processor', m.processing),
                                  ('processing_cost', 'guild', -m.processing)) AS e(kind, account, amount)
       WHERE m.needs_payment AND o.paid_at IS NOT NULL AND e.amount <> 0`,
      [currency],
    );
    // What a refund or a paid cancellation writes: every entry but the processing cost reversed, dated at the refund.
    await client.query(
      `INSERT INTO ledger_entries (transaction_id, order_id, kind, reverses, account, amount_minor, currency, created_at)
       SELECT m.refund_transaction, e.order_id, 'refund', e.kind, e.account, -e.amount_minor, e.currency, o.refunded_at
       FROM bench_money m JOIN orders o ON o.id = m.id JOIN ledger_entries e ON e.order_id = o.id
       WHERE o.refunded_at IS NOT NULL AND e.kind <> 'processing_cost'`,
    );

    // Early each month the treasurer pays every seller what the previous month's sales left them owed.
    await client.query(
      `CREATE TEMP TABLE bench_payouts ON COMMIT DROP AS
       SELECT gen_random_uuid() AS id, gen_random_uuid() AS transaction_id, substring(account from 8)::uuid AS seller_id,
              sum(amount_minor)::int AS amount, date_trunc('month', created_at) + interval '1 month 4 days 10 hours' AS paid_at
       FROM ledger_entries
       WHERE account LIKE 'seller:%' AND order_id IS NOT NULL
       GROUP BY account, date_trunc('month', created_at)
       HAVING sum(amount_minor) > 0 AND date_trunc('month', created_at) + interval '1 month 4 days 10 hours' < now()`,
    );
    await client.query(
      `INSERT INTO payouts (id, seller_id, amount_minor, currency, method, reference, recorded_by, created_at)
       SELECT id, seller_id, amount, $1, 'bank transfer', 'Payout ' || to_char(paid_at - interval '1 month', 'YYYY-MM'), $2, paid_at FROM bench_payouts`,
      [currency, treasurerId],
    );
    await client.query(
      `INSERT INTO ledger_entries (transaction_id, payout_id, kind, account, amount_minor, currency, created_at)
       SELECT p.transaction_id, p.id, 'payout', e.account, e.amount, $1, p.paid_at
       FROM bench_payouts p CROSS JOIN LATERAL (VALUES ('seller:' || p.seller_id, -p.amount), ('payouts', p.amount)) AS e(account, amount)`,
      [currency],
    );
    for (const [table, trigger] of OFFICE_TALLY_TRIGGERS) await client.query(`ALTER TABLE ${table} ENABLE TRIGGER ${trigger}`);
    await client.query('DELETE FROM office_tallies');
    await client.query('INSERT INTO office_tallies (grain, day, figure, key, amount, compacted) SELECT *, true FROM office_tallies_expected()');
    await client.query('COMMIT');
    await client.query('VACUUM (ANALYZE) bundles, meetings, orders, order_items, ledger_entries, payouts, office_tallies');
    await verify(client, settings);
    return { loaded: true, seconds: (Date.now() - started) / 1000, ...(await counts(client)) };
  } catch (error) {
    await client.query('ROLLBACK').catch(() => undefined);
    throw error;
  } finally {
    await client.end();
  }
}
