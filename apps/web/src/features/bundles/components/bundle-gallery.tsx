import type { PhotoView } from '@scrap-relay/shared';
import { useState } from 'react';
import { cn } from '../../../utils/cn.ts';

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
        alt={altFor(photos.indexOf(current))}
        width={current.width}
        height={current.height}
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
                <img src={photo.thumbUrl} alt={`Show ${altFor(index)}`} className="size-16 rounded object-cover sm:size-20" style={{ backgroundColor: photo.averageHex }} />
              </button>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
