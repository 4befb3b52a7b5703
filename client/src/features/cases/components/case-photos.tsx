import { useEffect, useId, useRef, useState } from 'react';
import type { PhotoView } from '@shared/case-schemas';
import { Button } from '../../../components/ui/button';

/**
 * The case's photos as a grid of thumbnails; choosing one shows it large in a modal dialog
 * (Escape or the close button returns to the grid, arrows step through).
 */
export function CasePhotos({ photos, title }: { photos: PhotoView[]; title: string }) {
  const [open, setOpen] = useState<number | null>(null);
  if (photos.length === 0) return <p className="text-loam-soft">No photos yet.</p>;
  return (
    <>
      <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4" aria-label="Photos of the batch">
        {photos.map((photo, index) => (
          <li key={photo.id}>
            <button
              type="button"
              onClick={() => setOpen(index)}
              className="block w-full overflow-hidden rounded-soft border-2 border-line bg-rice-deep hover:border-moss"
            >
              <img
                src={photo.thumbUrl}
                alt={`Photo ${index + 1} of ${photos.length}: ${title}. Open it larger.`}
                width={photo.width}
                height={photo.height}
                loading="lazy"
                className="aspect-square h-auto w-full object-cover"
              />
            </button>
          </li>
        ))}
      </ul>
      {open !== null && (
        <PhotoViewer photos={photos} index={open} title={title} onIndex={setOpen} onClose={() => setOpen(null)} />
      )}
    </>
  );
}

function PhotoViewer({
  photos,
  index,
  title,
  onIndex,
  onClose,
}: {
  photos: PhotoView[];
  index: number;
  title: string;
  onIndex: (index: number) => void;
  onClose: () => void;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const headingId = useId();
  const photo = photos[index];
  const many = photos.length > 1;
  const step = (by: number) => onIndex((index + by + photos.length) % photos.length);

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    // showModal gives focus trapping, Escape and an inert page behind for free.
    if (!dialog.open) dialog.showModal();
    return () => dialog.close();
  }, []);

  return (
    <dialog
      ref={ref}
      aria-labelledby={headingId}
      onClose={() => {
        // Closing in the effect's cleanup queues a close event; when the effect has opened the
        // dialog again since (StrictMode runs effects twice), that stale event is not a close.
        if (!ref.current?.open) onClose();
      }}
      onKeyDown={(event) => {
        if (!many) return;
        if (event.key === 'ArrowRight') step(1);
        if (event.key === 'ArrowLeft') step(-1);
      }}
      onClick={(event) => {
        // A click on the dim backdrop (the dialog box itself, outside its content) closes it.
        if (event.target === event.currentTarget) ref.current?.close();
      }}
      className="m-auto h-dvh max-h-none w-dvw max-w-none bg-transparent p-0 backdrop:bg-loam/85 sm:p-6"
    >
      <div className="mx-auto flex h-full max-w-5xl flex-col gap-3 bg-loam p-3 text-rice sm:rounded-soft sm:p-4">
        <div className="flex items-center justify-between gap-3">
          <h2 id={headingId} className="font-extrabold">
            Photo {index + 1} of {photos.length}
          </h2>
          <Button variant="secondary" onClick={() => ref.current?.close()} autoFocus>
            Close
          </Button>
        </div>
        <div className="flex min-h-0 flex-1 items-center justify-center">
          <img
            src={photo.url}
            alt={`Photo ${index + 1} of ${photos.length}: ${title}`}
            width={photo.width}
            height={photo.height}
            className="h-auto max-h-full w-auto max-w-full object-contain"
          />
        </div>
        {many && (
          <div className="flex justify-between gap-3">
            <Button variant="secondary" onClick={() => step(-1)}>
              <span aria-hidden="true">←</span> Previous
            </Button>
            <Button variant="secondary" onClick={() => step(1)}>
              Next <span aria-hidden="true">→</span>
            </Button>
          </div>
        )}
      </div>
    </dialog>
  );
}
