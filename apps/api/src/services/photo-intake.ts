// Photos sent with a report: read into memory with hard limits, checked by their content (never by the
// name or the type the browser claims), re-encoded so nothing but pixels survives (no EXIF, no GPS),
// shrunk to a sensible size with a small thumbnail, then stored and recorded on the call.
import type { Request, Response } from 'express';
import multer from 'multer';
import sharp from 'sharp';
import { fileTypeFromBuffer } from 'file-type';
import type { Tx } from '@bumperline/db/client';
import { insertEvent } from '@bumperline/db/queries/call-events';
import { insertPhoto } from '@bumperline/db/queries/call-photos';
import type { PhotoStore } from './photo-store.ts';

export const PHOTO_MAX_BYTES = 10 * 1024 * 1024;
const ACCEPTED = new Set(['image/jpeg', 'image/png', 'image/webp']);
/** Longest edge kept: plenty to read a part number, far less than a phone camera's full size. */
const MAX_EDGE = 2560;
const THUMB_EDGE = 320;
/**
 * 50 megapixels (8,660 × 5,773): more than any phone saves by default. Checked from the file's header
 * before anything is decoded, so a small file that would decode to a huge image ("image bomb") costs
 * nothing; sharp's own limit stays as a second guard.
 */
export const MAX_INPUT_PIXELS = 50_000_000;

/** A form that could not be read, with the status and the field to show the message beside. */
export interface FormProblem {
  status: 400 | 413;
  field: string;
  message: string;
}

export interface ParsedForm {
  file?: Express.Multer.File;
  problem?: FormProblem;
}

/**
 * Reads a multipart form into req.body (fields) and memory (at most one file, field `fileField`).
 * A limit that is hit stops the upload there; whatever fields arrived before stay in req.body.
 */
export function multipartForm(opts: { fileField: string; maxBytes?: number; fieldLabels?: Record<string, string> }) {
  const maxBytes = opts.maxBytes ?? PHOTO_MAX_BYTES;
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 8, parts: 10, fieldNameSize: 40, fieldSize: 16 * 1024 },
  }).single(opts.fileField);
  const megabytes = Math.round(maxBytes / (1024 * 1024));

  function describe(err: unknown): FormProblem {
    if (!(err instanceof multer.MulterError)) {
      return { status: 400, field: 'form', message: 'The form did not arrive complete. Please send it again.' };
    }
    switch (err.code) {
      case 'LIMIT_FILE_SIZE':
        return {
          status: 413,
          field: opts.fileField,
          message: `The photo is larger than ${megabytes} MB. Choose a smaller one, or send the report without it.`,
        };
      case 'LIMIT_FILE_COUNT':
      case 'LIMIT_UNEXPECTED_FILE':
        return { status: 400, field: opts.fileField, message: 'Send one photo at most.' };
      case 'LIMIT_FIELD_VALUE': {
        const label = err.field ? opts.fieldLabels?.[err.field] : undefined;
        return label
          ? { status: 400, field: err.field!, message: `${label} is too long.` }
          : { status: 400, field: 'form', message: 'Part of the form is too long.' };
      }
      default:
        return { status: 400, field: 'form', message: 'The form has more parts than expected. Please use the form on this page.' };
    }
  }

  return (req: Request, res: Response): Promise<ParsedForm> =>
    new Promise((resolve) => {
      upload(req, res, (err: unknown) => {
        if (err) resolve({ problem: describe(err) });
        else resolve({ file: req.file });
      });
    });
}

export interface PreparedPhoto {
  photo: Buffer;
  thumb: Buffer;
  contentType: 'image/jpeg';
  width: number;
  height: number;
}

export class PhotoRejected extends Error {}

/**
 * Checks the bytes are a JPEG, PNG or WebP picture and re-encodes it. `.rotate()` first applies the
 * camera's orientation so the picture stays upright once the EXIF block is gone (sharp keeps no
 * metadata unless asked). Runs before any database work, so a bad photo stores nothing.
 */
export async function preparePhoto(bytes: Buffer): Promise<PreparedPhoto> {
  const type = await fileTypeFromBuffer(bytes);
  if (!type || !ACCEPTED.has(type.mime)) throw new PhotoRejected('The photo must be a JPEG, PNG or WebP picture.');
  const header = await sharp(bytes)
    .metadata()
    .catch(() => undefined);
  if (!header?.width || !header.height) {
    throw new PhotoRejected('We could not read this picture. Try another photo, or send the report without it.');
  }
  if (header.width * header.height > MAX_INPUT_PIXELS) {
    const megapixels = Math.round((header.width * header.height) / 1e6);
    throw new PhotoRejected(
      `The picture is ${header.width} × ${header.height} pixels (${megapixels} megapixels); the most we take is ${MAX_INPUT_PIXELS / 1e6}. Send a smaller photo, or the report without it.`,
    );
  }
  try {
    const { data, info } = await sharp(bytes, { failOn: 'error', limitInputPixels: MAX_INPUT_PIXELS })
      .rotate()
      .resize({ width: MAX_EDGE, height: MAX_EDGE, fit: 'inside', withoutEnlargement: true })
      .flatten({ background: '#ffffff' })
      .jpeg({ quality: 82, mozjpeg: true })
      .toBuffer({ resolveWithObject: true });
    const thumb = await sharp(data)
      .resize({ width: THUMB_EDGE, height: THUMB_EDGE, fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 70 })
      .toBuffer();
    return { photo: data, thumb, contentType: 'image/jpeg', width: info.width, height: info.height };
  } catch {
    throw new PhotoRejected('We could not read this picture. Try another photo, or send the report without it.');
  }
}

/**
 * Writes a prepared photo and its thumbnail to the store; each key goes into `written` as it lands, so the caller
 * can remove them if the transaction fails later. Returns what a photo row keeps of it.
 */
export async function storePreparedPhoto(store: PhotoStore, photo: PreparedPhoto, written?: string[]) {
  const storageKey = await store.write(photo.photo, 'jpg');
  written?.push(storageKey);
  const thumbKey = await store.write(photo.thumb, 'webp');
  written?.push(thumbKey);
  return { storageKey, thumbKey, contentType: photo.contentType, bytes: photo.photo.length, width: photo.width, height: photo.height };
}

/** Stores a prepared photo and its thumbnail, and records it on the call and its timeline. */
export async function savePhoto(
  tx: Tx,
  store: PhotoStore,
  p: { callId: string; photo: PreparedPhoto; uploadedBy: string; actorUserId?: string | null; actorLabel: string; written?: string[] },
): Promise<string> {
  const stored = await storePreparedPhoto(store, p.photo, p.written);
  const photoId = await insertPhoto(tx, { callId: p.callId, ...stored, uploadedBy: p.uploadedBy });
  await insertEvent(tx, {
    callId: p.callId,
    kind: 'photo',
    actorUserId: p.actorUserId ?? null,
    actorLabel: p.actorLabel,
    detail: { photoId },
  });
  return photoId;
}
