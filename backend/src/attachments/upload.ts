import type { RequestHandler } from 'express';
import multer from 'multer';
import { textRuleError } from '@shared/schemas';
import { AppError } from '../http/errors';

interface UploadOptions {
  field: string;
  maxBytes: number;
  /** Checked on the declared type and name before the bytes are kept; the content is checked later. */
  accept?: (file: { mimetype: string; originalname: string }) => boolean;
  /** What the file must be, for the 415 message, e.g. "a CSV file (.csv or text/csv)". */
  expected: string;
}

function sizeLabel(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${bytes / (1024 * 1024)} MB` : `${Math.round(bytes / 1024)} kB`;
}

/**
 * One file in memory from a multipart form field, with a size limit (413) and a type gate (415);
 * multer's own errors become the API's error shape. Use after the auth and role checks, so
 * nobody uploads bytes they may not store.
 */
export function singleUpload(options: UploadOptions): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: options.maxBytes, files: 1, fields: 10 },
    fileFilter: (_req, file, cb) => {
      // The file name is stored and shown: refused, not altered, when it is not plain text.
      const nameError = textRuleError(file.originalname);
      if (nameError) return cb(AppError.validation(`The file name ${nameError}. Rename the file and upload it again.`, [{ field: options.field, message: `file name ${nameError}` }]));
      if (!options.accept || options.accept(file)) cb(null, true);
      else cb(unsupportedType(options.field, options.expected, `${file.originalname} (${file.mimetype})`));
    },
  }).single(options.field);
  return (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!err) {
        if (!req.file) return next(AppError.validation(`Attach the file in the form field "${options.field}".`, [{ field: options.field, message: `is required: ${options.expected}` }]));
        return next();
      }
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return next(new AppError({ status: 413, code: 'file_too_large', message: `The file is larger than ${sizeLabel(options.maxBytes)}.`, fields: [{ field: options.field, message: `must be at most ${sizeLabel(options.maxBytes)}` }] }));
        }
        return next(AppError.validation(`Upload refused: ${err.message}. Send one file in the form field "${options.field}".`, [{ field: err.field ?? options.field, message: err.message }]));
      }
      if (err instanceof AppError) return next(err);
      // Anything else comes from reading the form itself (busboy): the body is not a
      // well-formed multipart/form-data request, so it is the client's to fix.
      next(malformedMultipart(err, options.field));
    });
  };
}

/**
 * A 400 for a multipart body the form reader could not read: cut short ("Unexpected end of
 * form"), a broken part header, no boundary, or another multipart type than form-data.
 */
export function malformedMultipart(err: unknown, field: string): AppError {
  const detail = err instanceof Error ? err.message : String(err);
  let reason: string;
  if (/unsupported content type/i.test(detail)) reason = 'the Content-Type must be multipart/form-data';
  else if (/boundary not found/i.test(detail)) reason = 'the Content-Type names no boundary (multipart/form-data; boundary=…)';
  else if (/unexpected end of form/i.test(detail)) reason = 'the form ends before its closing boundary';
  else if (/malformed part header/i.test(detail)) reason = 'a part has a malformed header';
  else reason = 'the body is not a well-formed multipart/form-data form';
  return new AppError({
    status: 400,
    code: 'malformed_multipart',
    message: `Upload refused: ${reason} (${detail}). Send one file in the form field "${field}" as multipart/form-data.`,
    fields: [{ field, message: `must be sent as multipart/form-data: ${reason}` }],
  });
}

export function unsupportedType(field: string, expected: string, found: string): AppError {
  return new AppError({ status: 415, code: 'unsupported_file_type', message: `Expected ${expected}; found ${found}.`, fields: [{ field, message: `must be ${expected}` }] });
}
