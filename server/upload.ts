/**
 * Reading an uploaded spectrum: a multipart form (file field `spectrum`,
 * other fields as text) or a raw body of one of SPECTRUM_CONTENT_TYPES. Kept
 * in memory, never written to disk, with a size limit; upload errors become
 * FieldgapErrors (413 too large, 415 wrong type, 400 malformed).
 */
import express, { type NextFunction, type Request, type RequestHandler, type Response } from 'express';
import multer from 'multer';
import { FieldgapError } from '../src/errors.js';
import { SPECTRUM_CONTENT_TYPES } from './schemas.js';

/** What the upload middleware leaves in res.locals.spectrum. */
export interface UploadedSpectrum {
  content: Buffer;
  /** The uploaded file's name, or one made from the content type for a raw body (a stored original's name). */
  fileName: string | undefined;
  /** What messages call the upload: the multipart file's own name when it has one, else "request body" (never a name the user did not give). */
  label: string;
  /** Query parameters, then form fields (a form field wins over a query parameter of the same name). */
  fields: Record<string, unknown>;
}

const RAW_EXTENSIONS: Record<string, string> = {
  'text/csv': 'spectrum.csv',
  'text/tab-separated-values': 'spectrum.tsv',
  'text/plain': 'spectrum.txt',
  'chemical/x-jcamp-dx': 'spectrum.jdx',
};

/** The name error messages give a spectrum sent as the raw body. */
export const REQUEST_BODY = 'request body';

function describeBytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${(bytes / (1024 * 1024)).toFixed(bytes % (1024 * 1024) === 0 ? 0 : 1)} MiB` : `${bytes} bytes`;
}

/** multer's errors as FieldgapErrors naming the form field. */
function multerToFieldgapError(error: multer.MulterError, maxBytes: number): FieldgapError {
  const field = error.field ?? 'spectrum';
  switch (error.code) {
    case 'LIMIT_FILE_SIZE':
      return new FieldgapError('too-large', `${field}: the file is larger than the limit of ${describeBytes(maxBytes)}`, field);
    case 'LIMIT_UNEXPECTED_FILE':
    case 'LIMIT_FILE_COUNT':
      return new FieldgapError(
        'invalid-argument',
        `${field}: unexpected file field; send one spectrum, in the form field "spectrum"`,
        field,
      );
    case 'LIMIT_FIELD_VALUE':
    case 'LIMIT_FIELD_KEY':
    case 'LIMIT_FIELD_COUNT':
    case 'LIMIT_PART_COUNT':
      return new FieldgapError('too-large', `${field}: ${error.message.toLowerCase()} in the form`, field);
    default:
      return new FieldgapError('invalid-argument', `${field}: ${error.message.toLowerCase()}`, field);
  }
}

function hasBody(req: Request): boolean {
  const length = req.headers['content-length'];
  return req.headers['transfer-encoding'] !== undefined || (length !== undefined && length !== '0');
}

/** The middleware that reads the spectrum into res.locals.spectrum, or fails with a FieldgapError. */
export function spectrumUpload(maxBytes: number): RequestHandler {
  const form = multer({
    storage: multer.memoryStorage(),
    // Browsers send a file name as UTF-8 bytes without saying so; busboy's default (latin1) turns "Cr–aqua μ.csv" into mojibake.
    defParamCharset: 'utf8',
    limits: { fileSize: maxBytes, files: 1, fields: 30, fieldSize: 4096, parts: 32 },
  }).single('spectrum');
  const raw = express.raw({ type: () => true, limit: maxBytes });

  return (req: Request, res: Response, next: NextFunction) => {
    const query = { ...(req.query as Record<string, unknown>) };
    const done = (content: Buffer | undefined, fileName: string | undefined, formFields: Record<string, unknown>, label = REQUEST_BODY) => {
      if (content === undefined) {
        next(
          new FieldgapError(
            'invalid-argument',
            'spectrum: no spectrum in the request: upload it as the form field "spectrum" (multipart/form-data) or send it as the body with Content-Type text/csv, text/plain or chemical/x-jcamp-dx',
            'spectrum',
          ),
        );
        return;
      }
      if (content.length === 0) {
        next(new FieldgapError('invalid-argument', 'spectrum: the uploaded spectrum is empty', 'spectrum'));
        return;
      }
      const spectrum: UploadedSpectrum = { content, fileName, label, fields: { ...query, ...formFields } };
      res.locals['spectrum'] = spectrum;
      next();
    };

    if (req.is('multipart/form-data')) {
      form(req, res, (error: unknown) => {
        if (error instanceof multer.MulterError) return next(multerToFieldgapError(error, maxBytes));
        if (error instanceof Error) {
          return next(new FieldgapError('parse-error', `body: the multipart form could not be read: ${error.message}`, 'body'));
        }
        if (error) return next(error);
        const fields = { ...(req.body as Record<string, unknown> | undefined) };
        const name = req.file?.originalname;
        return done(req.file?.buffer, name, fields, name !== undefined && name !== '' ? name : 'form field "spectrum"');
      });
      return;
    }
    if (!hasBody(req)) return done(undefined, undefined, {});
    const type = req.is([...SPECTRUM_CONTENT_TYPES]);
    if (typeof type !== 'string') {
      const given = req.headers['content-type'] ?? '(none)';
      next(
        new FieldgapError(
          'unsupported-format',
          `Content-Type: ${given} is not a spectrum upload; use multipart/form-data (field "spectrum") or one of ${SPECTRUM_CONTENT_TYPES.join(', ')}`,
          'Content-Type',
        ),
      );
      return;
    }
    raw(req, res, (error: unknown) => {
      if (error) return next(error);
      const body = Buffer.isBuffer(req.body) ? (req.body as Buffer) : undefined;
      done(body, RAW_EXTENSIONS[type], {});
    });
  };
}
