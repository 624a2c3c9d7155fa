import { MAX_PHOTO_BYTES, MAX_PHOTOS_PER_BUNDLE, type BundleView, type PhotoView } from '@scrap-relay/shared';
import { useEffect, useId, useRef, useState, type DragEvent } from 'react';
import { Button, buttonClass } from '../../../components/ui/button.tsx';
import { ConfirmDialog } from '../../../components/ui/dialog.tsx';
import { cn } from '../../../utils/cn.ts';
import { useDeletePhoto } from '../api/delete-photo.ts';
import { useReorderPhotos } from '../api/reorder-photos.ts';
import { dismissUpload, isUploading, usePhotoUploads, type UploadItem } from '../hooks/use-photo-uploads.ts';

const MB = 1024 * 1024;

export interface PhotoManagerProps {
  /** Null on the "new" page until the first save creates the draft. */
  bundle: BundleView | null;
  /** Files the member chose or dropped, already cut to the photos still allowed. */
  onAddFiles: (files: File[]) => void;
  /** Set while the draft is being created for the first photos. */
  isStarting?: boolean;
}

/** A phone's camera is worth offering only where there is one to point (touch screens). */
function useHasCamera(): boolean {
  const [coarse] = useState(() => typeof window !== 'undefined' && window.matchMedia?.('(pointer: coarse)').matches === true);
  return coarse;
}

/** Touch screens choose or take photos; a mouse may also drag them in, which a narrow window does not offer room for. */
function AddPhotosLead({ touch }: { touch: boolean }) {
  if (touch) return 'Choose photos, or take them now with the camera.';
  return (
    <>
      <span className="sm:hidden">Choose photos of the bundle.</span>
      <span className="hidden sm:inline">Drag photos here, or</span>
    </>
  );
}

/**
 * Photos of the bundle: add by choosing, photographing or dropping files; a
 * progress bar per photo while it uploads; reorder with buttons (keyboard and
 * touch alike); delete with a confirmation. The first photo is the cover.
 */
export function PhotoManager({ bundle, onAddFiles, isStarting = false }: PhotoManagerProps) {
  const photos = bundle?.photos ?? [];
  const uploads = usePhotoUploads(bundle?.id ?? null);
  const pending = uploads.filter((item) => item.status === 'waiting' || item.status === 'sending' || item.status === 'processing').length;
  const free = Math.max(MAX_PHOTOS_PER_BUNDLE - photos.length - pending, 0);
  const hasCamera = useHasCamera();
  const [dragging, setDragging] = useState(false);
  const [refused, setRefused] = useState<string | null>(null);
  const [announcement, setAnnouncement] = useState('');
  const pickerRef = useRef<HTMLInputElement>(null);
  const cameraRef = useRef<HTMLInputElement>(null);
  const hintId = useId();

  const take = (list: FileList | null) => {
    const files = [...(list ?? [])];
    if (files.length === 0) return;
    setRefused(
      files.length > free
        ? free === 0
          ? `This bundle already has ${MAX_PHOTOS_PER_BUNDLE} photos. Delete one to add another.`
          : `A bundle has at most ${MAX_PHOTOS_PER_BUNDLE} photos, so only the first ${free} of the ${files.length} you chose will be added.`
        : null,
    );
    const accepted = files.slice(0, free);
    if (accepted.length > 0) onAddFiles(accepted);
  };

  const onDrop = (event: DragEvent<HTMLDivElement>) => {
    event.preventDefault();
    setDragging(false);
    take(event.dataTransfer.files);
  };

  const full = free === 0;
  return (
    <div className="space-y-5">
      <div
        onDragOver={(event) => {
          event.preventDefault();
          if (!full) setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={onDrop}
        className={cn(
          'space-y-3 rounded-stitch border-4 border-dashed p-5 text-center',
          dragging ? 'border-cornflower bg-muslin' : 'border-selvage bg-linen',
        )}
      >
        <p className="text-lg font-semibold">{full ? 'This bundle has all the photos it can hold.' : <AddPhotosLead touch={hasCamera} />}</p>
        <div className="flex flex-wrap justify-center gap-3">
          <Button onClick={() => pickerRef.current?.click()} disabled={full || isStarting} aria-describedby={hintId} isPending={isStarting} pendingLabel="Starting your draft…">
            Choose photos
          </Button>
          {hasCamera ? (
            <Button variant="secondary" onClick={() => cameraRef.current?.click()} disabled={full || isStarting} aria-describedby={hintId}>
              Take a photo
            </Button>
          ) : null}
        </div>
        <p id={hintId} className="text-thread-soft">
          {photos.length + pending} of {MAX_PHOTOS_PER_BUNDLE} photos. JPEG, PNG or WebP, up to {MAX_PHOTO_BYTES / MB} MB each. Location
          details are removed from every photo.
        </p>
        {/* Visually hidden but reachable through the buttons above, which say what they do. */}
        <input
          ref={pickerRef}
          type="file"
          accept="image/*"
          multiple
          aria-label="Choose photos"
          className="sr-only"
          tabIndex={-1}
          onChange={(event) => {
            take(event.target.files);
            event.target.value = '';
          }}
        />
        <input
          ref={cameraRef}
          type="file"
          accept="image/*"
          capture="environment"
          aria-label="Take a photo"
          className="sr-only"
          tabIndex={-1}
          onChange={(event) => {
            take(event.target.files);
            event.target.value = '';
          }}
        />
      </div>

      {refused ? (
        <p role="alert" className="font-semibold text-madder-deep">
          {refused}
        </p>
      ) : null}

      {uploads.length > 0 ? <UploadList uploads={uploads} /> : null}

      {bundle && photos.length > 0 ? (
        <PhotoList bundle={bundle} photos={photos} busy={isUploading(uploads)} onAnnounce={setAnnouncement} />
      ) : (
        <p className="text-thread-soft">
          No photos yet. Take them in daylight: one of the whole bundle laid out, and a close-up or two of the fabric.
        </p>
      )}
      <p role="status" className="sr-only">
        {announcement}
      </p>
    </div>
  );
}

const statusWords: Record<UploadItem['status'], string> = {
  waiting: 'Waiting',
  sending: 'Uploading',
  processing: 'Making the thumbnail',
  done: 'Uploaded',
  failed: 'Not added',
};

function UploadList({ uploads }: { uploads: UploadItem[] }) {
  return (
    <section aria-label="Uploads" className="space-y-3">
      <h3 className="font-bold">Uploads</h3>
      <ul className="space-y-3">
        {uploads.map((item) => {
          const percent = item.size > 0 ? Math.round((item.loaded / item.size) * 100) : 0;
          const shown = item.status === 'done' || item.status === 'processing' ? 100 : percent;
          return (
            <li key={item.key} className="space-y-1.5 rounded-stitch border-2 border-seam bg-muslin p-3">
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <span className="font-semibold [overflow-wrap:anywhere]">{item.fileName}</span>
                <span className="text-thread-soft">
                  {statusWords[item.status]}
                  {item.status === 'sending' ? ` ${percent} %` : ''}
                  {item.status === 'done' ? ' ✓' : ''}
                </span>
              </div>
              {item.status !== 'failed' ? (
                <div
                  role="progressbar"
                  aria-label={`Upload of ${item.fileName}`}
                  aria-valuemin={0}
                  aria-valuemax={100}
                  aria-valuenow={shown}
                  aria-valuetext={`${statusWords[item.status]}: ${shown} %`}
                  className="h-3 overflow-hidden rounded-full border border-thread-soft bg-linen"
                >
                  <div className={cn('h-full transition-[width]', item.status === 'done' ? 'bg-sage' : 'bg-thread')} style={{ width: `${shown}%` }} />
                </div>
              ) : (
                <div role="alert" className="flex flex-wrap items-start justify-between gap-2">
                  <p className="font-semibold text-madder-deep">
                    <span aria-hidden="true">✗ </span>
                    {item.error}
                  </p>
                  <Button variant="quiet" onClick={() => dismissUpload(item.key)}>
                    Dismiss<span className="sr-only"> the message about {item.fileName}</span>
                  </Button>
                </div>
              )}
            </li>
          );
        })}
      </ul>
    </section>
  );
}

type MoveAction = 'earlier' | 'later';

function PhotoList({ bundle, photos, busy, onAnnounce }: { bundle: BundleView; photos: PhotoView[]; busy: boolean; onAnnounce: (text: string) => void }) {
  const reorder = useReorderPhotos();
  const remove = useDeletePhoto();
  const [confirming, setConfirming] = useState<{ photo: PhotoView; position: number } | null>(null);
  const buttons = useRef(new Map<string, HTMLButtonElement>());
  const refocus = useRef<{ photoId: string; action: MoveAction } | null>(null);

  // After a move the list re-renders in the new order: keep focus on the photo that moved.
  useEffect(() => {
    const target = refocus.current;
    if (!target) return;
    refocus.current = null;
    const other: MoveAction = target.action === 'earlier' ? 'later' : 'earlier';
    const button = buttons.current.get(`${target.photoId}:${target.action}`);
    (button && !button.disabled ? button : buttons.current.get(`${target.photoId}:${other}`))?.focus();
  }, [photos]);

  const move = (index: number, action: MoveAction) => {
    const to = action === 'earlier' ? index - 1 : index + 1;
    const ids = photos.map((photo) => photo.id);
    const [moved] = ids.splice(index, 1);
    if (!moved) return;
    ids.splice(to, 0, moved);
    // Set before sending: the new order may render before the success callback runs.
    refocus.current = { photoId: moved, action };
    reorder.mutate(
      { bundleId: bundle.id, photoIds: ids },
      {
        onSuccess: () => onAnnounce(`Photo moved to position ${to + 1} of ${ids.length}.${to === 0 ? ' It is now the cover photo.' : ''}`),
        onError: () => {
          refocus.current = null;
          buttons.current.get(`${moved}:${action}`)?.focus();
        },
      },
    );
  };

  const problem = reorder.error ?? remove.error;
  return (
    <section aria-label="Your photos" className="space-y-3">
      <h3 className="font-bold">Your photos</h3>
      <p className="text-thread-soft">The first photo is the cover on the shelf. Move the clearest one to the front.</p>
      {problem ? (
        <p role="alert" className="font-semibold text-madder-deep">
          <span aria-hidden="true">✗ </span>
          {problem.message}
        </p>
      ) : null}
      <ol className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4">
        {photos.map((photo, index) => {
          const position = index + 1;
          const setButton = (action: MoveAction) => (element: HTMLButtonElement | null) => {
            if (element) buttons.current.set(`${photo.id}:${action}`, element);
            else buttons.current.delete(`${photo.id}:${action}`);
          };
          const disabled = reorder.isPending || remove.isPending || busy;
          return (
            <li key={photo.id} className="space-y-2 rounded-stitch border-2 border-seam bg-muslin p-2">
              <div className="relative">
                <img
                  src={photo.thumbUrl}
                  alt={`Photo ${position} of ${photos.length}${position === 1 ? ' (cover)' : ''}`}
                  width={photo.width}
                  height={photo.height}
                  className="aspect-square w-full rounded-stitch object-cover"
                  style={{ backgroundColor: photo.averageHex }}
                />
                {position === 1 ? (
                  <span className="absolute top-1 left-1 rounded-stitch bg-thread px-2 text-sm font-semibold text-white">Cover</span>
                ) : null}
              </div>
              <div className="grid gap-1 min-[480px]:grid-cols-2">
                <button
                  ref={setButton('earlier')}
                  type="button"
                  className={buttonClass('secondary', 'px-2')}
                  disabled={disabled || index === 0}
                  onClick={() => move(index, 'earlier')}
                >
                  <span aria-hidden="true">←</span> Earlier<span className="sr-only"> (move photo {position} earlier)</span>
                </button>
                <button
                  ref={setButton('later')}
                  type="button"
                  className={buttonClass('secondary', 'px-2')}
                  disabled={disabled || index === photos.length - 1}
                  onClick={() => move(index, 'later')}
                >
                  Later <span aria-hidden="true">→</span>
                  <span className="sr-only"> (move photo {position} later)</span>
                </button>
              </div>
              <Button variant="quiet" className="w-full" disabled={disabled} onClick={() => setConfirming({ photo, position })}>
                Delete<span className="sr-only"> photo {position}</span>
              </Button>
            </li>
          );
        })}
      </ol>
      {confirming ? (
        <ConfirmDialog
          open
          title={`Delete photo ${confirming.position}?`}
          confirmLabel="Delete photo"
          pendingLabel="Deleting…"
          confirmVariant="danger"
          isPending={remove.isPending}
          onCancel={() => setConfirming(null)}
          onConfirm={() =>
            remove.mutate(
              { bundleId: bundle.id, photoId: confirming.photo.id },
              {
                onSuccess: () => {
                  setConfirming(null);
                  onAnnounce(`Photo ${confirming.position} deleted.`);
                },
              },
            )
          }
        >
          <img src={confirming.photo.thumbUrl} alt="" className="max-h-40 rounded-stitch" />
          <p>The photo is removed from the bundle and from the guild’s storage.</p>
        </ConfirmDialog>
      ) : null}
    </section>
  );
}
