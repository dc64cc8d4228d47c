import type { Photo } from '@varden/schemas';
import { useRef, useState } from 'react';
import { Button } from '../../../components/button';
import { targetLabel } from '../lib/work-order-words';

const describe = (photo: Photo, index: number) => photo.caption || `Photo ${index + 1}${photo.target ? ` of the ${targetLabel(photo.target).toLowerCase()}` : ''}`;

/**
 * The order's photos as thumbnails; each opens its display size in a dialog over the page (the
 * thumbnail is also a plain link to the display size, which the printed record keeps).
 */
export function PhotoStrip({ photos }: { photos: readonly Photo[] }) {
  const dialog = useRef<HTMLDialogElement>(null);
  const [open, setOpen] = useState<number | null>(null);
  if (photos.length === 0) return <p className="text-ink-muted">No photos on this order.</p>;
  const shown = open === null ? undefined : photos[open];
  const show = (index: number) => {
    setOpen(index);
    dialog.current?.showModal();
  };

  return (
    <>
      <ul className="grid grid-cols-2 gap-3 min-[480px]:grid-cols-3 desk:grid-cols-4 print:grid-cols-4">
        {photos.map((photo, index) => (
          <li key={photo.id} className="print:break-inside-avoid">
            <a
              href={photo.displayUrl}
              onClick={(event) => {
                event.preventDefault();
                show(index);
              }}
              className="block rounded border border-line bg-sunken no-underline hover:border-line-strong"
            >
              <img src={photo.thumbnailUrl} alt={describe(photo, index)} loading="lazy" className="aspect-[4/3] w-full rounded-t object-cover" />
              <span className="block px-2 py-1 text-sm text-ink [overflow-wrap:anywhere]">{describe(photo, index)}</span>
            </a>
          </li>
        ))}
      </ul>
      <dialog
        ref={dialog}
        aria-label={shown ? describe(shown, open ?? 0) : 'Photo'}
        onClose={() => setOpen(null)}
        className="m-auto max-h-[92dvh] w-[min(60rem,94vw)] rounded-md border border-line-strong bg-surface p-0 text-ink backdrop:bg-ink/70"
      >
        {shown && (
          <figure className="grid gap-2 p-3">
            <img src={shown.displayUrl} alt={describe(shown, open ?? 0)} className="max-h-[75dvh] w-full object-contain" />
            <figcaption className="flex flex-wrap items-center justify-between gap-2">
              <span>{describe(shown, open ?? 0)}</span>
              <span className="flex gap-2">
                {photos.length > 1 && (
                  <>
                    <Button onClick={() => setOpen(((open ?? 0) - 1 + photos.length) % photos.length)}>Previous</Button>
                    <Button onClick={() => setOpen(((open ?? 0) + 1) % photos.length)}>Next</Button>
                  </>
                )}
                <Button variant="primary" onClick={() => dialog.current?.close()} autoFocus>
                  Close
                </Button>
              </span>
            </figcaption>
          </figure>
        )}
      </dialog>
    </>
  );
}
