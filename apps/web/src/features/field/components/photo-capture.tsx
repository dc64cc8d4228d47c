import type { Photo } from '@varden/schemas';
import { useEffect, useId, useRef, useState, type ChangeEvent } from 'react';
import { buttonClassName } from '../../../components/button';
import { newIdempotencyKey } from '../outbox/answer-outcome';
import { photoItemsOf } from '../outbox/outbox-queries';
import type { OutboxItem, PhotoTarget } from '../outbox/outbox-types';
import { fieldOutbox, useOutboxSnapshot } from '../outbox/use-field-outbox';
import { OutboxItemStatus } from './outbox-item-status';

/** A photo still on the phone, drawn from its blob. */
function BlobThumbnail({ blob, alt }: { blob: Blob; alt: string }) {
  const image = useRef<HTMLImageElement>(null);
  useEffect(() => {
    const url = URL.createObjectURL(blob);
    if (image.current) image.current.src = url;
    return () => URL.revokeObjectURL(url);
  }, [blob]);
  return <img ref={image} alt={alt} width={96} height={96} className="size-24 rounded border border-line bg-sunken object-cover" />;
}

function WaitingPhoto({ item }: { item: OutboxItem }) {
  if (item.payload.kind !== 'photo') return null;
  const caption = item.payload.caption || 'Photo';
  return (
    <li className="grid grid-cols-[6rem_1fr] items-start gap-3" data-testid="waiting-photo">
      <BlobThumbnail blob={item.payload.file} alt={`${caption}, on this phone`} />
      <div className="grid min-w-0 gap-1">
        <p className="font-medium break-words">{caption}</p>
        <OutboxItemStatus item={item} what="Photo" />
      </div>
    </li>
  );
}

type PhotoCaptureProps = {
  orderId: number;
  /** Whose photos: a component of the bank, or the whole order when undefined. */
  target?: PhotoTarget;
  targetId?: number;
  /** What the photo is of, for the outbox and the captions: "Step 1, unit 2". */
  subject: string;
  stored: readonly Photo[];
};

/**
 * Photos from the phone's camera (capture="environment": the rear camera). Each is written to
 * the outbox with its idempotency key at once, uploaded with its progress, and shown as a
 * thumbnail: from the phone while it waits, from the server once stored.
 */
export function PhotoCapture({ orderId, target, targetId, subject, stored }: PhotoCaptureProps) {
  const { items } = useOutboxSnapshot();
  const inputId = useId();
  const captionId = useId();
  const [caption, setCaption] = useState('');
  const waiting = photoItemsOf(items, orderId, target, targetId);
  const mine = stored.filter((photo) => (photo.target ?? undefined) === target && (photo.targetId ?? undefined) === targetId);

  const onFiles = async (event: ChangeEvent<HTMLInputElement>) => {
    const files = [...(event.target.files ?? [])];
    event.target.value = '';
    for (const file of files) {
      await fieldOutbox().add({
        orderId,
        label: `Photo · ${subject}`,
        payload: {
          kind: 'photo',
          idempotencyKey: newIdempotencyKey(),
          file,
          fileName: file.name || 'photo.jpg',
          caption: caption.trim().slice(0, 300),
          ...(target && targetId !== undefined ? { target, targetId } : {}),
        },
      });
    }
    setCaption('');
  };

  return (
    <div className="grid gap-3">
      <div className="grid gap-2 desk:grid-cols-[1fr_auto] desk:items-end">
        <div className="grid gap-1">
          <label htmlFor={captionId} className="font-medium">
            Photo caption <span className="font-normal text-ink-muted">(optional)</span>
          </label>
          <input
            id={captionId}
            type="text"
            maxLength={300}
            value={caption}
            onChange={(event) => setCaption(event.target.value)}
            className="min-h-touch w-full min-w-0 rounded border border-line-strong bg-surface px-3 text-base text-ink"
          />
        </div>
        <label htmlFor={inputId} className={buttonClassName('secondary', 'cursor-pointer has-focus-visible:outline-3 has-focus-visible:outline-focus')}>
          <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-5 fill-none stroke-current stroke-[1.5]">
            <path d="M2 5h2.5L6 3h4l1.5 2H14v8H2Z" strokeLinejoin="round" />
            <circle cx="8" cy="8.5" r="2.5" />
          </svg>
          Take a photo
          <input id={inputId} type="file" accept="image/*" capture="environment" className="sr-only" onChange={(event) => void onFiles(event)} />
        </label>
      </div>
      {(waiting.length > 0 || mine.length > 0) && (
        <ul className="grid gap-3" aria-label={`Photos of ${subject}`}>
          {waiting.map((item) => (
            <WaitingPhoto key={item.id} item={item} />
          ))}
          {mine.map((photo) => (
            <li key={photo.id} className="grid grid-cols-[6rem_1fr] items-start gap-3" data-testid="stored-photo">
              <a href={photo.displayUrl} target="_blank" rel="noreferrer" className="rounded">
                <img src={photo.thumbnailUrl} alt={photo.caption || `Photo of ${subject}`} width={96} height={96} className="size-24 rounded border border-line object-cover" />
              </a>
              <div className="grid min-w-0 gap-1">
                <p className="font-medium break-words">{photo.caption || 'Photo'}</p>
                <OutboxItemStatus item={undefined} storedAt={photo.createdAt} what="Photo" />
              </div>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
