// @vitest-environment happy-dom
import { MAX_PHOTO_BYTES, type BundleView } from '@scrap-relay/shared';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from '../../../lib/api-client.ts';
import type { UploadPhotoOptions } from '../api/upload-photo.ts';
import { createElement } from 'react';
import { render } from '../../../testing/render.tsx';

/** A scripted server: each upload waits until the test answers it, so the order and the progress can be watched. */
const pending: Array<{ options: UploadPhotoOptions; answer: (result: unknown) => void; fail: (error: unknown) => void }> = [];
vi.mock('../api/upload-photo.ts', () => ({
  uploadPhoto: (options: UploadPhotoOptions) =>
    new Promise((resolve, reject) => pending.push({ options, answer: resolve, fail: reject })),
}));

const { dismissUpload, queuePhotoUploads, uploadErrorMessage, usePhotoUploads } = await import('./use-photo-uploads.ts');

const photo = (name: string, size = 1000) => new File([new Uint8Array(size)], name, { type: 'image/jpeg' });
const bundleAnswer = (id: string) => ({ bundle: { id } as BundleView });
const flush = () => new Promise((resolve) => setTimeout(resolve, 0));

/** The queue as a component sees it, through the hook. */
async function itemsOf(bundleId: string) {
  let seen: ReturnType<typeof usePhotoUploads> = [];
  function Probe() {
    seen = usePhotoUploads(bundleId);
    return null;
  }
  const { unmount } = await render(createElement(Probe));
  unmount();
  return seen;
}

afterEach(() => {
  pending.length = 0;
});

describe('photo upload queue', () => {
  it('sends one photo at a time in the order chosen, reporting progress, then hands back the bundle', async () => {
    const uploaded = vi.fn();
    queuePhotoUploads({ bundleId: 'b-1', files: [photo('whole-bag.jpg'), photo('close-up.jpg')], onUploaded: uploaded });
    await flush();

    expect(pending.map((p) => p.options.file.name)).toEqual(['whole-bag.jpg']);
    expect((await itemsOf('b-1')).map((i) => `${i.fileName}:${i.status}`)).toEqual(['whole-bag.jpg:sending', 'close-up.jpg:waiting']);

    pending[0]!.options.onProgress?.({ loaded: 400, total: 1000 });
    expect((await itemsOf('b-1'))[0]).toMatchObject({ status: 'sending', loaded: 400, size: 1000 });
    pending[0]!.options.onProgress?.({ loaded: 1000, total: 1000 });
    expect((await itemsOf('b-1'))[0]).toMatchObject({ status: 'processing' });

    pending[0]!.answer(bundleAnswer('b-1'));
    await flush();
    expect(uploaded).toHaveBeenCalledTimes(1);
    expect(pending.map((p) => p.options.file.name)).toEqual(['whole-bag.jpg', 'close-up.jpg']);
    pending[1]!.answer(bundleAnswer('b-1'));
    await flush();
    expect((await itemsOf('b-1')).map((i) => i.status)).toEqual(['done', 'done']);
  });

  it('refuses a file over 15 MB without sending it, and carries on with the rest', async () => {
    queuePhotoUploads({ bundleId: 'b-2', files: [photo('huge.jpg', MAX_PHOTO_BYTES + 1), photo('fine.jpg')], onUploaded: () => {} });
    await flush();
    expect(pending.map((p) => p.options.file.name)).toEqual(['fine.jpg']);
    const [huge] = await itemsOf('b-2');
    expect(huge).toMatchObject({ status: 'failed', error: expect.stringMatching(/over 15 MB/) });
    pending[0]!.answer(bundleAnswer('b-2'));
    await flush();
  });

  it('shows the API’s refusal on the photo it belongs to, and lets it be dismissed', async () => {
    queuePhotoUploads({ bundleId: 'b-3', files: [photo('notes.jpg')], onUploaded: () => {} });
    await flush();
    pending[0]!.fail(new ApiError(415, 'unsupported_media_type', 'That file is not a photo we can read. Use a JPEG, PNG or WebP photo.'));
    await flush();
    const [item] = await itemsOf('b-3');
    expect(item).toMatchObject({ status: 'failed', error: 'That file is not a photo we can read. Use a JPEG, PNG or WebP photo.' });
    dismissUpload(item!.key);
    expect(await itemsOf('b-3')).toEqual([]);
  });

  it('words each refusal the photo step can meet', () => {
    expect(uploadErrorMessage(new ApiError(413, 'payload_too_large', 'The request is too large.'))).toMatch(/over 15 MB/);
    expect(uploadErrorMessage(new ApiError(400, 'bad_request', 'A bundle has at most 8 photos; it has 8.'))).toBe('A bundle has at most 8 photos; it has 8.');
    expect(uploadErrorMessage(new ApiError(422, 'unprocessable', 'That image is far larger than any camera photo, so it was refused.'))).toMatch(/far larger/);
    expect(uploadErrorMessage(new TypeError('boom'))).toMatch(/could not be sent/);
  });
});
