import { pipeline } from 'node:stream/promises';
import { photoUploadFields } from '@varden/schemas';
import { Router, type RequestHandler, type Response } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { allow } from '../../access/allow';
import { signedInUser } from '../../access/current-user';
import type { AppContext } from '../../context';
import { AppError } from '../../http/app-error';
import { validate } from '../../http/validate';
import { addPhoto, assertOrderVisible, openPhoto, photosOfVisibleOrder, type PhotoFields, type PhotoVariant } from './photos.service';

const idParams = z.object({ id: z.coerce.number().int().positive() });
const id = (res: Response) => (res.locals.params as z.output<typeof idParams>).id;

/** Photos: upload on an order (multipart, field `file`), list an order's, serve a rendition. */
export function photoRoutes(ctx: AppContext): Router {
  const router = Router();
  const receive = receiveOnePhoto(ctx.config.PHOTO_MAX_BYTES);

  router.post(
    '/work-orders/:id/photos',
    allow('work-orders:perform'),
    validate({ params: idParams }),
    // An order the user cannot see is refused before its upload is read.
    async (_req, res, next) => {
      await assertOrderVisible(ctx.db, signedInUser(res), id(res));
      next();
    },
    receive,
    validate({ body: photoUploadFields }),
    async (req, res) => {
      const { photo, created } = await addPhoto(ctx, signedInUser(res), id(res), res.locals.body as PhotoFields, req.file);
      res.status(created ? 201 : 200).json(photo);
    },
  );

  router.get('/work-orders/:id/photos', allow('work-orders:read'), validate({ params: idParams }), async (_req, res) => {
    const items = await photosOfVisibleOrder(ctx.db, signedInUser(res), id(res));
    res.json({ items, total: items.length });
  });

  const serve = (variant: PhotoVariant): RequestHandler[] => [
    allow('work-orders:read'),
    validate({ params: idParams }),
    async (_req, res) => {
      const photo = await openPhoto(ctx, signedInUser(res), id(res), variant);
      res.setHeader('Content-Type', photo.contentType);
      if (photo.length !== undefined) res.setHeader('Content-Length', String(photo.length));
      // Renditions never change (a new photo gets a new id), but they are private evidence.
      res.setHeader('Cache-Control', 'private, max-age=86400');
      res.setHeader('Content-Disposition', `inline; filename="photo-${id(res)}-${variant}.webp"`);
      try {
        await pipeline(photo.body, res);
      } catch (error) {
        ctx.log.warn({ err: error }, 'photo stream ended early');
        res.destroy();
      }
    },
  ];
  router.get('/photos/:id/display', ...serve('display'));
  router.get('/photos/:id/thumbnail', ...serve('thumbnail'));

  return router;
}

/** multer in memory with the configured size limit; its errors become the API's JSON errors. */
function receiveOnePhoto(maxBytes: number): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 8, fieldSize: 4096, parts: 10, headerPairs: 100 },
  }).single('file');
  return (req, res, next) => {
    upload(req, res, (error: unknown) => next(error === undefined ? undefined : uploadError(error, maxBytes)));
  };
}

function uploadError(error: unknown, maxBytes: number): unknown {
  if (error instanceof multer.MulterError) {
    if (error.code === 'LIMIT_FILE_SIZE') {
      const mb = (maxBytes / (1024 * 1024)).toFixed(0);
      return new AppError('too_large', `The photo is larger than the ${mb} MB limit.`, { file: `At most ${mb} MB` });
    }
    if (error.code === 'LIMIT_UNEXPECTED_FILE' || error.code === 'LIMIT_FILE_COUNT') {
      return new AppError('invalid', 'Send one photo, in the field "file".', { file: 'One photo, in the field "file"' });
    }
    return new AppError('invalid', `The upload is not valid: ${error.message}.`);
  }
  if (error instanceof Error) return new AppError('invalid', 'The upload was cut off or is not valid multipart/form-data. Send it again.');
  return error;
}
