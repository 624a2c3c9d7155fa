import type { PhotoView } from '@scrap-relay/shared';
import { useState } from 'react';
import { cn } from '../../../utils/cn.ts';
import { photoSrcSet } from '../../../utils/photo-sources.ts';

/**
 * The shown photo's width in CSS px (bundle page: app-shell, Page "wide", BundleDetails), in px because the
 * app's root size is 18 px while `sizes` reads rem as 16: main padding 18 px a side, 27 from 640 px; from
 * 1024 the photo takes 3/5 of the row after a 27 px gap; the menu (270 px) once the shell is 1080 px wide;
 * the shell stops growing at 1440; a 2 px border. Measured in Chromium at 412, 800, 1100 and 1440 px.
 */
const SHOWN_SIZES = [
  '(min-width: 1440px) 650px',
  '(min-width: 1080px) calc(60vw - 215px)',
  '(min-width: 1024px) calc(60vw - 53px)',
  '(min-width: 640px) calc(100vw - 58px)',
  'calc(100vw - 40px)',
].join(', ');

/** The display-size photo with thumbnails to switch between them; each photo's alt text names the bundle and its place. */
export function BundleGallery({ photos, title }: { photos: PhotoView[]; title: string }) {
  const [shown, setShown] = useState(0);
  const current = photos[Math.min(shown, photos.length - 1)];
  if (!current) {
    return (
      <div className="flex aspect-[4/3] items-center justify-center rounded-stitch border-2 border-dashed border-selvage bg-linen text-thread-soft">
        No photos yet
      </div>
    );
  }
  const altFor = (index: number) => `${title || 'Bundle'}: photo ${index + 1} of ${photos.length}`;
  return (
    <div className="space-y-3">
      <img
        src={current.url}
        srcSet={photoSrcSet(current)}
        sizes={SHOWN_SIZES}
        alt={altFor(photos.indexOf(current))}
        width={current.width}
        height={current.height}
        // The page's largest paint.
        fetchPriority="high"
        className="max-h-[70vh] w-full rounded-stitch border-2 border-seam object-contain"
        style={{ backgroundColor: current.averageHex }}
      />
      {photos.length > 1 ? (
        <ul aria-label="All photos" className="flex flex-wrap gap-2">
          {photos.map((photo, index) => (
            <li key={photo.id}>
              <button
                type="button"
                aria-pressed={photo === current}
                onClick={() => setShown(index)}
                className={cn('block rounded-stitch border-4 p-0.5', photo === current ? 'border-thread' : 'border-transparent hover:border-seam')}
              >
                <img
                  src={photo.thumbUrl}
                  alt={`Show ${altFor(index)}`}
                  width={80}
                  height={80}
                  loading="lazy"
                  decoding="async"
                  className="size-16 rounded object-cover sm:size-20"
                  style={{ backgroundColor: photo.averageHex }}
                />
              </button>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
