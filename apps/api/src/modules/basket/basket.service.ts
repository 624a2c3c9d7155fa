import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { MAX_BASKET_LINES, type BasketAddInput, type BasketView } from '@scrap-relay/shared';
import { BasketItem, Bundle, Member } from '../../db/models/index.ts';
import { AppError, conflict, forbidden, notFound, unprocessable } from '../../errors/index.ts';

/** The member's basket, oldest line first. */
export async function basketOf(memberId: string, transaction?: Transaction): Promise<BasketView> {
  const items = await BasketItem.findAll({ where: { memberId }, order: [['addedAt', 'ASC'], ['bundleId', 'ASC']], transaction });
  return { items: items.map((i) => ({ bundleId: i.bundleId, quantity: i.quantity, addedAt: i.addedAt.toISOString() })) };
}

/**
 * Puts a bundle on the shelf in the member's basket. A bundle already there keeps the larger of the two quantities,
 * so a reload of the add link or a basket brought over from an older device adds nothing twice. Whether enough copies
 * are left is the checkout's question (the basket page lowers what asks for too many); the basket only refuses what
 * can never be ordered from it, naming `bundleId`. The member's row is locked, so two devices adding at once keep
 * the limit of lines.
 */
export async function addToBasket(sequelize: Sequelize, member: Member, input: Required<BasketAddInput>): Promise<BasketView> {
  return sequelize.transaction(async (transaction) => {
    await Member.findByPk(member.id, { transaction, lock: transaction.LOCK.UPDATE, attributes: ['id'] });
    const bundle = await Bundle.findByPk(input.bundleId, { transaction, attributes: ['id', 'state', 'offer', 'sellerId'] });
    if (!bundle || bundle.state === 'draft') throw new AppError(404, 'not_found', 'There is no bundle at that link; its owner may have withdrawn it.');
    if (bundle.sellerId === member.id) throw forbidden('That is your own listing, so it cannot go in your basket.');
    if (bundle.offer === 'starter') {
      throw unprocessable('Starter bundles are claimed from the starter shelf, not bought through the basket.', { bundleId: 'A starter bundle.' });
    }
    if (bundle.state !== 'on_shelf') throw conflict('That bundle is no longer on the shelf.', { bundleId: 'Not on the shelf.' });
    const [counted] = await sequelize.query<{ lines: number; here: boolean }>(
      `SELECT count(*)::int AS lines, bool_or(bundle_id = $2) AS here FROM basket_items WHERE member_id = $1`,
      { bind: [member.id, bundle.id], transaction, type: QueryTypes.SELECT },
    );
    if (!counted?.here && (counted?.lines ?? 0) >= MAX_BASKET_LINES) {
      throw unprocessable(`Your basket holds at most ${MAX_BASKET_LINES} bundles. Check some out or take some out first.`, { bundleId: 'The basket is full.' });
    }
    await sequelize.query(
      `INSERT INTO basket_items (member_id, bundle_id, quantity) VALUES ($1, $2, $3)
       ON CONFLICT (member_id, bundle_id) DO UPDATE SET quantity = GREATEST(basket_items.quantity, EXCLUDED.quantity)`,
      { bind: [member.id, bundle.id, input.quantity], transaction, type: QueryTypes.INSERT },
    );
    return basketOf(member.id, transaction);
  });
}

/** Sets how many copies a line asks for; 404 for a bundle not in the basket. */
export async function setBasketQuantity(member: Member, bundleId: string, quantity: number): Promise<BasketView> {
  const [changed] = await BasketItem.update({ quantity }, { where: { memberId: member.id, bundleId } });
  if (changed === 0) throw notFound('That bundle in your basket');
  return basketOf(member.id);
}

/** Takes bundles out of the basket; one already gone is no error (another device took it out first). */
export async function removeFromBasket(member: Member, bundleIds: string[], transaction?: Transaction): Promise<void> {
  if (bundleIds.length > 0) await BasketItem.destroy({ where: { memberId: member.id, bundleId: bundleIds }, transaction });
}
