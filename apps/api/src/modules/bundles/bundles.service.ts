import { randomUUID } from 'node:crypto';
import type { Transaction } from 'sequelize';
import {
  bundleCompleteSchema,
  bundleDraftSchema,
  CUT_SIZE_KIND,
  formatMoney,
  MAX_PHOTOS_PER_BUNDLE,
  minimumCardChargeMinor,
  toHex,
  type BundleDraftInput,
} from '@scrap-relay/shared';
import { Bundle, BundlePhoto, type Member } from '../../db/models/index.ts';
import { AppError, badRequest, notFound } from '../../errors/index.ts';
import { authorize, can, type Actor } from '../../policies/index.ts';
import type { AppContext } from '../../context.ts';
import { loadGuild } from '../guild/guild.service.ts';
import { processPhoto, type ProcessedPhoto } from './photo-pipeline.ts';

export async function findBundle(id: string, transaction?: Transaction, lock = false): Promise<Bundle> {
  const bundle = await Bundle.findByPk(id, { transaction, lock: lock && transaction ? transaction.LOCK.UPDATE : undefined });
  if (!bundle) throw notFound('That bundle');
  return bundle;
}

/** A bundle the actor may see; others' hidden bundles answer 404, so ids reveal nothing. */
export async function viewableBundle(actor: Actor, id: string): Promise<Bundle> {
  const bundle = await Bundle.findByPk(id, { include: [{ association: 'photos' }, { association: 'seller' }], order: [['photos', 'position', 'ASC']] });
  if (!bundle || !can(actor, 'bundle.view', bundle)) throw notFound('That bundle');
  return bundle;
}

function draftFields(bundle: Bundle): BundleDraftInput {
  return {
    title: bundle.title || undefined,
    description: bundle.description,
    offer: (bundle.offer ?? undefined) as BundleDraftInput['offer'],
    priceMinor: bundle.priceMinor,
    meetingHandoverOk: bundle.meetingHandoverOk,
    quantity: bundle.quantity,
    weightGrams: bundle.weightGrams ?? undefined,
    fibre: bundle.fibre ?? undefined,
    cutKinds: bundle.cutKinds,
    cutSizes: bundle.cutSizes,
    colourValue: bundle.colourValue,
    colourFamily: bundle.colourFamily,
    prewashed: bundle.prewashed,
    smokeFree: bundle.smokeFree,
    petFree: bundle.petFree,
    pieces: bundle.pieces,
  };
}

/** Choosing a free offer clears the price and the handover choice unless the same request sets them (then the schema refuses). */
function mergeDraft(current: BundleDraftInput, patch: BundleDraftInput): BundleDraftInput {
  const merged = { ...current, ...patch };
  // Unticking a cut kind drops its sizes too, unless the same request says which sizes to keep.
  if (patch.cutKinds && !('cutSizes' in patch)) merged.cutSizes = (current.cutSizes ?? []).filter((size) => patch.cutKinds!.includes(CUT_SIZE_KIND[size]));
  if (patch.offer && patch.offer !== 'sale') {
    if (!('priceMinor' in patch)) merged.priceMinor = null;
    if (!('meetingHandoverOk' in patch)) merged.meetingHandoverOk = false;
  }
  const checked = bundleDraftSchema.safeParse(merged);
  if (!checked.success) {
    const fields = Object.fromEntries(checked.error.issues.map((i) => [i.path.join('.') || 'body', i.message]));
    throw badRequest(`Please check: ${Object.keys(fields).join(', ')}.`, fields);
  }
  return checked.data;
}

function toColumns(d: BundleDraftInput) {
  return {
    ...d,
    title: d.title ?? '',
    offer: d.offer ?? null,
    priceMinor: d.priceMinor ?? null,
    weightGrams: d.weightGrams ?? null,
    fibre: d.fibre ?? null,
    colourValue: d.colourValue ?? null,
    colourFamily: d.colourFamily ?? null,
  };
}

export async function createDraft(ctx: AppContext, seller: Member, input: BundleDraftInput): Promise<Bundle> {
  authorize(seller, 'bundle.create');
  const guild = await loadGuild();
  const fields = mergeDraft({}, input);
  return Bundle.create({ sellerId: seller.id, currency: guild.currency, ...toColumns(fields), quantityAvailable: fields.quantity ?? 1 });
}

export async function updateDraft(ctx: AppContext, seller: Member, id: string, patch: BundleDraftInput): Promise<Bundle> {
  return ctx.sequelize.transaction(async (transaction) => {
    const bundle = await findBundle(id, transaction, true);
    authorize(seller, 'bundle.edit', bundle);
    const fields = mergeDraft(draftFields(bundle), patch);
    // Packs sold or held by orders that still stand stay out of what a relisted bundle offers.
    const committed = bundle.quantity - bundle.quantityAvailable;
    const quantity = fields.quantity ?? bundle.quantity;
    if (quantity < committed) {
      throw badRequest('The quantity is below the packs already sold.', {
        quantity: `${committed} of these packs ${committed === 1 ? 'is' : 'are'} sold or held already, so the quantity cannot be less than ${committed}.`,
      });
    }
    await bundle.update({ ...toColumns(fields), quantityAvailable: quantity - committed }, { transaction });
    return bundle;
  });
}

function photoKeys(bundleId: string) {
  const photoId = randomUUID();
  return {
    photoId,
    displayKey: `photos/${bundleId}/${photoId}-1600.webp`,
    mediumKey: `photos/${bundleId}/${photoId}-800.webp`,
    thumbKey: `photos/${bundleId}/${photoId}-400.webp`,
  };
}

/** Processes every file first, then stores them and adds the rows in one transaction; on any failure nothing is kept. */
export async function addPhotos(ctx: AppContext, seller: Member, id: string, files: Express.Multer.File[]): Promise<void> {
  if (files.length === 0) throw badRequest('Choose at least one photo.', { photos: 'No photo was sent.' });
  const bundle = await findBundle(id);
  authorize(seller, 'bundle.edit', bundle);
  const processed: ProcessedPhoto[] = [];
  for (const file of files) processed.push(await processPhoto(file.buffer));

  const written: string[] = [];
  try {
    await ctx.sequelize.transaction(async (transaction) => {
      const locked = await findBundle(id, transaction, true);
      authorize(seller, 'bundle.edit', locked);
      const existing = await BundlePhoto.count({ where: { bundleId: id }, transaction });
      if (existing + processed.length > MAX_PHOTOS_PER_BUNDLE) {
        throw badRequest(`A bundle has at most ${MAX_PHOTOS_PER_BUNDLE} photos; it has ${existing}.`, {
          photos: `At most ${MAX_PHOTOS_PER_BUNDLE} photos per bundle.`,
        });
      }
      const maxPosition = (await BundlePhoto.max<number, BundlePhoto>('position', { where: { bundleId: id }, transaction })) ?? -1;
      for (const [i, photo] of processed.entries()) {
        const keys = photoKeys(id);
        await ctx.storage.put(keys.displayKey, photo.display.data);
        written.push(keys.displayKey);
        await ctx.storage.put(keys.mediumKey, photo.medium.data);
        written.push(keys.mediumKey);
        await ctx.storage.put(keys.thumbKey, photo.thumb.data);
        written.push(keys.thumbKey);
        await BundlePhoto.create(
          {
            id: keys.photoId,
            bundleId: id,
            position: maxPosition + 1 + i,
            displayKey: keys.displayKey,
            mediumKey: keys.mediumKey,
            thumbKey: keys.thumbKey,
            contentType: photo.contentType,
            width: photo.display.width,
            height: photo.display.height,
            averageHex: toHex(photo.average),
          },
          { transaction },
        );
      }
    });
  } catch (err) {
    await Promise.all(written.map((key) => ctx.storage.remove(key)));
    throw err;
  }
}

export async function removePhoto(ctx: AppContext, seller: Member, id: string, photoId: string): Promise<void> {
  const removed = await ctx.sequelize.transaction(async (transaction) => {
    const bundle = await findBundle(id, transaction, true);
    authorize(seller, 'bundle.edit', bundle);
    const photo = await BundlePhoto.findOne({ where: { id: photoId, bundleId: id }, transaction });
    if (!photo) throw notFound('That photo');
    await photo.destroy({ transaction });
    return photo;
  });
  const keys = [removed.displayKey, removed.mediumKey, removed.thumbKey].filter((key) => key !== null);
  await Promise.all(keys.map((key) => ctx.storage.remove(key)));
}

export async function reorderPhotos(ctx: AppContext, seller: Member, id: string, photoIds: string[]): Promise<void> {
  await ctx.sequelize.transaction(async (transaction) => {
    const bundle = await findBundle(id, transaction, true);
    authorize(seller, 'bundle.edit', bundle);
    const photos = await BundlePhoto.findAll({ where: { bundleId: id }, transaction });
    const known = new Set(photos.map((p) => p.id));
    if (photoIds.length !== photos.length || !photoIds.every((p) => known.has(p)) || new Set(photoIds).size !== photoIds.length) {
      throw badRequest('List every photo of the bundle exactly once.', { photoIds: 'Must list every photo of the bundle once.' });
    }
    for (const [position, photoId] of photoIds.entries()) {
      await BundlePhoto.update({ position }, { where: { id: photoId }, transaction });
    }
  });
}

/** draft, returned, withdrawn or expired → in_review, once the listing is complete and has a photo. */
export async function submitForReview(ctx: AppContext, seller: Member, id: string): Promise<Bundle> {
  return ctx.sequelize.transaction(async (transaction) => {
    const bundle = await findBundle(id, transaction, true);
    authorize(seller, 'bundle.submit', bundle);
    const complete = bundleCompleteSchema.safeParse(draftFields(bundle));
    const fields: Record<string, string> = complete.success
      ? {}
      : Object.fromEntries(complete.error.issues.map((i) => [i.path.join('.') || 'body', i.message]));
    const photoCount = await BundlePhoto.count({ where: { bundleId: id }, transaction });
    if (photoCount === 0) fields.photos = 'Add at least one photo.';
    if (bundle.quantityAvailable === 0) fields.quantity = 'Every pack of this listing is sold or held; raise the quantity if you have more.';
    const minimum = minimumCardChargeMinor(bundle.currency);
    if (bundle.offer === 'sale' && bundle.priceMinor !== null && bundle.priceMinor < minimum) {
      fields.priceMinor = `Prices start at ${formatMoney(minimum, bundle.currency)}, the least a card payment can be; or offer it free.`;
    }
    if (Object.keys(fields).length > 0) {
      throw new AppError(422, 'unprocessable', `The listing is not complete yet: ${Object.keys(fields).join(', ')}.`, fields);
    }
    await bundle.update(
      { state: 'in_review', submittedAt: ctx.now(), reviewNotes: null, onShelfAt: null, expiresAt: null },
      { transaction },
    );
    return bundle;
  });
}

export async function withdraw(ctx: AppContext, seller: Member, id: string): Promise<Bundle> {
  return ctx.sequelize.transaction(async (transaction) => {
    const bundle = await findBundle(id, transaction, true);
    authorize(seller, 'bundle.withdraw', bundle);
    await bundle.update({ state: 'withdrawn', expiresAt: null }, { transaction });
    return bundle;
  });
}

export async function listOwnBundles(seller: Member): Promise<Bundle[]> {
  return Bundle.findAll({
    where: { sellerId: seller.id },
    include: [{ association: 'photos' }, { association: 'seller' }],
    order: [
      ['updatedAt', 'DESC'],
      ['photos', 'position', 'ASC'],
    ],
  });
}
