import { useMemo, useSyncExternalStore } from 'react';
import { MAX_PHOTO_BYTES, type BundleView } from '@scrap-relay/shared';
import { isApiError } from '../../../lib/api-client.ts';
import { uploadPhoto } from '../api/upload-photo.ts';

export type UploadStatus = 'waiting' | 'sending' | 'processing' | 'done' | 'failed';

export interface UploadItem {
  key: string;
  bundleId: string;
  fileName: string;
  size: number;
  loaded: number;
  status: UploadStatus;
  error: string | null;
}

/**
 * Photo uploads live outside any component: they keep going while the member
 * moves between steps, and a draft created on the "new" page hands its uploads
 * to the edit page it opens.
 */
let items: readonly UploadItem[] = [];
const listeners = new Set<() => void>();
const queues = new Map<string, Promise<void>>();
let nextKey = 1;

function publish(next: readonly UploadItem[]) {
  items = next;
  for (const listener of listeners) listener();
}

function patch(key: string, change: Partial<UploadItem>) {
  publish(items.map((item) => (item.key === key ? { ...item, ...change } : item)));
}

const MB = 1024 * 1024;

/** Wording per refusal; the API's own message where it is already plain. */
export function uploadErrorMessage(error: unknown): string {
  if (!isApiError(error)) return 'The photo could not be sent. Please try again.';
  switch (error.status) {
    case 413:
      return `This photo is over ${MAX_PHOTO_BYTES / MB} MB. Choose a smaller copy (most phones can share a photo at a reduced size).`;
    case 415:
      return error.message || 'That file is not a photo. Use a JPEG, PNG or WebP photo.';
    case 422:
      return error.message || 'That image is too large to open.';
    default:
      return error.message;
  }
}

export interface QueueUploadsOptions {
  bundleId: string;
  files: readonly File[];
  /** Called with the bundle after each photo is stored (the caller keeps its cache up to date). */
  onUploaded: (bundle: BundleView) => void;
}

/** Adds files to the bundle's queue; they go one at a time, in the order chosen, so the photos keep that order. */
export function queuePhotoUploads({ bundleId, files, onUploaded }: QueueUploadsOptions): void {
  // A new batch replaces the finished lines of the last one.
  const kept = items.filter((item) => item.bundleId !== bundleId || (item.status !== 'done' && item.status !== 'failed'));
  const added = files.map<UploadItem>((file) => ({
    key: `upload-${nextKey++}`,
    bundleId,
    fileName: file.name || 'photo',
    size: file.size,
    loaded: 0,
    status: file.size > MAX_PHOTO_BYTES ? 'failed' : 'waiting',
    error:
      file.size > MAX_PHOTO_BYTES
        ? `This photo is over ${MAX_PHOTO_BYTES / MB} MB. Choose a smaller copy (most phones can share a photo at a reduced size).`
        : null,
  }));
  publish([...kept, ...added]);

  let queue = queues.get(bundleId) ?? Promise.resolve();
  added.forEach((item, index) => {
    const file = files[index];
    if (item.status === 'failed' || !file) return;
    queue = queue.then(async () => {
      patch(item.key, { status: 'sending' });
      try {
        const { bundle } = await uploadPhoto({
          bundleId,
          file,
          onProgress: ({ loaded, total }) =>
            // Every byte sent: the server is now resizing and stripping the photo's metadata.
            patch(item.key, { loaded: Math.min(loaded, total), size: total, status: loaded >= total ? 'processing' : 'sending' }),
        });
        patch(item.key, { status: 'done', loaded: item.size, error: null });
        onUploaded(bundle);
      } catch (error) {
        patch(item.key, { status: 'failed', error: uploadErrorMessage(error) });
      }
    });
  });
  queues.set(bundleId, queue);
}

export function dismissUpload(key: string): void {
  publish(items.filter((item) => item.key !== key));
}

function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

const snapshot = () => items;

/** This bundle's uploads (waiting, sending, finished or refused) as they change. */
export function usePhotoUploads(bundleId: string | null): UploadItem[] {
  const all = useSyncExternalStore(subscribe, snapshot, snapshot);
  return useMemo(() => all.filter((item) => item.bundleId === bundleId), [all, bundleId]);
}

export const isUploading = (list: readonly UploadItem[]) => list.some((item) => item.status === 'waiting' || item.status === 'sending' || item.status === 'processing');
