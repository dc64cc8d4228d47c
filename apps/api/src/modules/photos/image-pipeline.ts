import { availableParallelism } from 'node:os';
import sharp, { type Metadata, type Sharp } from 'sharp';
import { AppError } from '../../http/app-error';

// Every upload is a new image: libvips' operation cache would only hold decoded pixels that are
// never asked for again, and grow the process under parallel uploads.
sharp.cache(false);

/**
 * Photos decoded at once in this process: one per core. Decoding is CPU-bound, so more at once
 * only finishes each later and holds one more decoded image in memory (each 12 MP JPEG needs
 * tens of MB while it is read); uploads beyond that wait their turn, their bytes already read.
 */
const decodeSlots = availableParallelism();
let decoding = 0;
const waiting: Array<() => void> = [];

async function inDecodeSlot<T>(work: () => Promise<T>): Promise<T> {
  if (decoding >= decodeSlots) await new Promise<void>((resolve) => waiting.push(resolve));
  else decoding++;
  try {
    return await work();
  } finally {
    const next = waiting.shift();
    if (next) next();
    else decoding--;
  }
}

/** Longest side of the display image and of the thumbnail, px. */
export const displayMaxPx = 1600;
export const thumbnailMaxPx = 320;
export const storedContentType = 'image/webp';

export interface Rendition {
  data: Buffer;
  widthPx: number;
  heightPx: number;
}

export interface ProcessedPhoto {
  display: Rendition;
  thumbnail: Rendition;
  sourceFormat: AcceptedFormat;
}

type AcceptedFormat = 'jpeg' | 'png' | 'webp' | 'heif';

const heifBrands = new Set(['heic', 'heix', 'heim', 'heis', 'hevc', 'hevx', 'mif1', 'msf1', 'avif', 'avis']);

/**
 * The photo formats a phone sends, told from the first bytes (the name and the declared type
 * are never trusted). Anything else, SVG included, never reaches an image decoder.
 */
export function sniffPhotoFormat(data: Buffer): AcceptedFormat | undefined {
  if (data.length < 12) return undefined;
  if (data[0] === 0xff && data[1] === 0xd8 && data[2] === 0xff) return 'jpeg';
  if (data.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))) return 'png';
  if (data.toString('latin1', 0, 4) === 'RIFF' && data.toString('latin1', 8, 12) === 'WEBP') return 'webp';
  if (data.toString('latin1', 4, 8) === 'ftyp' && heifBrands.has(data.toString('latin1', 8, 12))) return 'heif';
  return undefined;
}

const notAPhoto = () =>
  new AppError('unsupported_media', 'This file is not a photo: send a JPEG, PNG, WebP or HEIF/AVIF image.', { file: 'Not a photo (JPEG, PNG, WebP, HEIF/AVIF)' });
const damaged = () =>
  new AppError('invalid', 'The photo is damaged or incomplete (the upload may have been cut off): take or send it again.', { file: 'Damaged or incomplete image' });
const tooManyPixels = (width: number, height: number, maxPixels: number) =>
  new AppError(
    'too_large',
    `The photo is ${width} × ${height} px (${((width * height) / 1e6).toFixed(0)} MP); the limit is ${(maxPixels / 1e6).toFixed(0)} MP.`,
    { file: `More than ${(maxPixels / 1e6).toFixed(0)} megapixels` },
  );

/**
 * Checks an upload and makes what is stored: the content must be a JPEG, PNG, WebP or HEIF
 * (AVIF) image whose header declares no more than `maxPixels`; it is decoded once with the
 * same pixel limit, turned upright from its EXIF orientation and re-encoded without any
 * metadata (EXIF, GPS, XMP, ICC all dropped) as a display size and a thumbnail in WebP.
 */
export async function processPhoto(data: Buffer, limits: { maxPixels: number }): Promise<ProcessedPhoto> {
  const sniffed = sniffPhotoFormat(data);
  if (!sniffed) throw notAPhoto();
  let metadata: Metadata;
  try {
    metadata = await sharp(data).metadata();
  } catch (error) {
    throw /unsupported image format/i.test(String(error)) ? notAPhoto() : damaged();
  }
  if (metadata.format !== sniffed) throw notAPhoto();
  if (sniffed === 'heif' && (metadata.compression === 'hevc' || !sharp.format.heif.input.buffer)) {
    throw new AppError(
      'unsupported_media',
      'HEIC photos (HEVC) cannot be read on this server. Set the camera to its most compatible format (JPEG) or send a JPEG.',
      { file: 'HEIC (HEVC) is not supported here; send a JPEG' },
    );
  }
  const width = metadata.width ?? 0;
  const height = metadata.height ?? 0;
  if (width <= 0 || height <= 0) throw damaged();
  if (width * height > limits.maxPixels) throw tooManyPixels(width, height, limits.maxPixels);

  // One decode, straight to display size: JPEG shrinks on load (DCT scaling), the rows are read
  // in order, and nothing full-size is kept. The thumbnail is made from the display WebP (a
  // 2 MP decode), not from the upload again; a raw display-size intermediate instead would save
  // ~30 ms but hold 6 MB per photo in memory until the garbage collector runs.
  return inDecodeSlot(async () => {
    let display: Rendition;
    try {
      display = await encode(
        sharp(data, { limitInputPixels: limits.maxPixels, failOn: 'warning', sequentialRead: true })
          .rotate()
          .resize({ width: displayMaxPx, height: displayMaxPx, fit: 'inside', withoutEnlargement: true, fastShrinkOnLoad: true }),
        82,
      );
    } catch (error) {
      if (/pixel limit/i.test(String(error))) throw tooManyPixels(width, height, limits.maxPixels);
      throw damaged();
    }
    const thumbnail = await encode(sharp(display.data).resize({ width: thumbnailMaxPx, height: thumbnailMaxPx, fit: 'inside', withoutEnlargement: true }), 72);
    return { display, thumbnail, sourceFormat: sniffed };
  });
}

/**
 * WebP at effort 2 of 6: about twice as fast to encode as the default 4 for files about 3 %
 * larger at the same quality (measured on a 12 MP photo, docs/performance.md).
 */
async function encode(image: Sharp, quality: number): Promise<Rendition> {
  const out = await image.webp({ quality, effort: 2 }).toBuffer({ resolveWithObject: true });
  return { data: out.data, widthPx: out.info.width, heightPx: out.info.height };
}
