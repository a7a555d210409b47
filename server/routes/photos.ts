import { Router, type Request, type Response } from 'express';
import multer from 'multer';
import type { Db } from '../../db/client';
import { PHOTO_MAX_BYTES } from '../../features/pieces/schema';
import { currentMember, requireMember } from '../auth';
import { HttpError, notFound } from '../errors';
import { addPhoto, deletePhoto, findPhotoFile, findPieceLabel } from '../services/photos';
import { sniffImage } from '../storage/photoImage';
import { sendStoredFile } from '../storage/sendStoredFile';
import type { Storage } from '../storage/storage';
import { idParam } from './params';

const MAX_MB = PHOTO_MAX_BYTES / (1024 * 1024);

// Memory, not disk: a refused upload then never touches storage, and 25 MB per
// request is small next to the server's memory. Names are UTF-8 from browsers.
const receiveOne = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: PHOTO_MAX_BYTES, files: 1, fields: 5, parts: 6 },
  defParamCharset: 'utf8',
}).single('photo');

const photoFieldError = (message: string) => new HttpError(400, 'invalid_input', message, { photo: message });

function uploadError(err: unknown): HttpError {
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') {
      return new HttpError(413, 'too_large', `The photo is larger than ${MAX_MB} MB. Save a smaller copy (4000 px on the long side is plenty) and try again.`);
    }
    if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') return photoFieldError('Send one photo, in the field named "photo"');
    return photoFieldError('The upload had more parts than a single photo needs');
  }
  return new HttpError(400, 'invalid_upload', 'The upload could not be read; it may have been cut short. Try again.');
}

/** Reads the one multipart file into memory, turning every upload problem into a clear HttpError. */
export function receivePhoto(req: Request, res: Response): Promise<Express.Multer.File> {
  return new Promise((resolve, reject) => {
    receiveOne(req, res, (err?: unknown) => {
      if (err) return reject(uploadError(err));
      if (!req.file) return reject(photoFieldError('Choose a photo to upload'));
      resolve(req.file);
    });
  });
}

/** The one multipart file when there is one (a form whose photo is optional), with the same limits and errors. */
export function receiveOptionalPhoto(req: Request, res: Response): Promise<Express.Multer.File | null> {
  return new Promise((resolve, reject) => {
    receiveOne(req, res, (err?: unknown) => (err ? reject(uploadError(err)) : resolve(req.file ?? null)));
  });
}

const variantParam = (value: unknown) => {
  if (value === 'preview' || value === 'original') return value;
  throw notFound('Photo');
};

/** Turns a HEIC upload into JPEG off the event loop; without it HEIC photos are refused with words on how to send JPEG. */
export type HeicConverter = (bytes: Buffer) => Promise<Buffer | null>;

/** Upload under a job's piece; read and delete by photo id. Paths are full because they span two resources. */
export function photoRoutes(db: Db, storage: Storage, heicToJpeg?: HeicConverter): Router {
  const router = Router();
  const staff = requireMember('owner', 'designer', 'front_desk');

  router.post('/jobs/:jobId/pieces/:pieceId/photos', staff, async (req, res) => {
    const member = currentMember(res.locals);
    const jobId = idParam(req.params.jobId, 'Job');
    const pieceId = idParam(req.params.pieceId, 'Piece');
    // Checked before reading the body, so nobody can make the server buffer 25 MB for someone else's piece.
    await findPieceLabel(db, member.shopId, jobId, pieceId);
    const file = await receivePhoto(req, res);
    const converted = heicToJpeg && sniffImage(file.buffer) === 'heif' ? await heicToJpeg(file.buffer) : null;
    const photo = await addPhoto(db, storage, {
      shopId: member.shopId,
      jobId,
      pieceId,
      memberId: member.id,
      bytes: converted ?? file.buffer,
      originalName: converted ? file.originalname.replace(/\.(heic|heif)$/i, '.jpg') : file.originalname,
    });
    res.status(201).json({ photo });
  });

  router.get('/photos/:photoId/:variant', staff, async (req, res) => {
    const photoId = idParam(req.params.photoId, 'Photo');
    const variant = variantParam(req.params.variant);
    const file = await findPhotoFile(db, currentMember(res.locals).shopId, photoId, variant);
    await sendStoredFile(res, storage, { ...file, what: 'Photo file' });
  });

  router.delete('/photos/:photoId', staff, async (req, res) => {
    const photoId = idParam(req.params.photoId, 'Photo');
    await deletePhoto(db, storage, currentMember(res.locals).shopId, photoId);
    res.status(204).end();
  });

  return router;
}
