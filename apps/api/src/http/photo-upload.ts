// Middleware that reads and prepares one uploaded photo (multipart field `photo`) before the route's transaction opens,
// so nobody without the permission uploads 10 MB, a refused photo stores nothing, and no database connection waits on a
// slow upload. The prepared photo is left in res.locals.photo for the handler.
import type { RequestHandler, Response } from 'express';
import type { Permission } from '@bumperline/contracts/roles';
import { HttpError, ValidationError } from './errors.ts';
import { requirePermission } from './guards.ts';
import { multipartForm, PhotoRejected, preparePhoto, type PreparedPhoto } from '../services/photo-intake.ts';

export function takePhoto(permission: Permission, fieldLabels?: Record<string, string>): RequestHandler {
  const readForm = multipartForm({ fileField: 'photo', fieldLabels });
  return async (req, res, next) => {
    requirePermission(req, permission);
    const form = await readForm(req, res);
    if (form.problem) {
      const { status, field, message } = form.problem;
      throw status === 413
        ? new HttpError(413, 'Photo too large', message, [{ field, message }], 'too-large')
        : new ValidationError([{ field, message }]);
    }
    if (!form.file || form.file.size === 0) throw new ValidationError([{ field: 'photo', message: 'choose a photo to add' }]);
    try {
      res.locals.photo = await preparePhoto(form.file.buffer);
    } catch (err) {
      if (err instanceof PhotoRejected) throw new ValidationError([{ field: 'photo', message: err.message }]);
      throw err;
    }
    next();
  };
}

/** The photo `takePhoto` prepared for this request. */
export const takenPhoto = (res: Response): PreparedPhoto => res.locals.photo as PreparedPhoto;
