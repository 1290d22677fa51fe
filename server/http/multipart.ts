import { mkdir, mkdtemp, rm } from 'node:fs/promises';
import path from 'node:path';
import type { Request, Response } from 'express';
import multer, { MulterError } from 'multer';
import { AppError } from '@/server/domain/app-error';

/** One received file, on local disk until the upload's `cleanup`. */
export interface ReceivedFile {
  path: string;
  originalName: string;
  bytes: number;
}

/** A multipart request received to a temporary folder. */
export interface ReceivedUpload {
  /** The request's own temporary folder (also free for the handler's scratch files). */
  dir: string;
  files: Partial<Record<string, ReceivedFile>>;
  /** Text fields, first value of each. */
  fields: Record<string, string>;
  /** Removes the folder and everything in it. Call it in `finally`. */
  cleanup(): Promise<void>;
}

/** Settings of {@link receiveUpload}. */
export interface ReceiveOptions {
  /** Parent of the per-request temporary folders. */
  tmpRoot: string;
  /** Largest file, bytes. */
  maxBytes: number;
  /** File fields accepted, one file each. */
  fileFields: readonly string[];
  /** The error for a file over `maxBytes` (names the limit for people). */
  tooLarge: (field: string) => AppError;
}

/**
 * Receives a multipart/form-data request with multer's disk storage into a new
 * folder under `tmpRoot`, streaming each file to disk (never holding it in
 * memory). Limits: `maxBytes` per file, one file per accepted field, a few
 * short text fields. On any failure the folder is removed before the error is
 * thrown; on success the caller removes it with `cleanup()`.
 *
 * @throws AppError 413 (via `tooLarge`), 400 `invalid_input` for unexpected
 *   fields, 400 `malformed_upload` for a broken multipart body
 */
export async function receiveUpload(req: Request, res: Response, options: ReceiveOptions): Promise<ReceivedUpload> {
  await mkdir(options.tmpRoot, { recursive: true });
  const dir = await mkdtemp(path.join(options.tmpRoot, 'upload-'));
  const cleanup = () => rm(dir, { recursive: true, force: true });
  const middleware = multer({
    storage: multer.diskStorage({ destination: dir }),
    limits: { fileSize: options.maxBytes, files: options.fileFields.length, fields: 10, fieldSize: 10_000, parts: 20 },
    // Browsers send UTF-8 file names; busboy would read them as Latin-1.
    defParamCharset: 'utf8',
  }).fields(options.fileFields.map((name) => ({ name, maxCount: 1 })));
  try {
    await new Promise<void>((resolve, reject) => {
      middleware(req, res, (error?: unknown) => (error ? reject(error) : resolve()));
    });
  } catch (error) {
    await cleanup();
    throw uploadError(error, options);
  }
  const uploaded = (req.files ?? {}) as Record<string, Express.Multer.File[]>;
  const files: Partial<Record<string, ReceivedFile>> = {};
  for (const name of options.fileFields) {
    const file = uploaded[name]?.[0];
    if (file) files[name] = { path: file.path, originalName: path.basename(file.originalname), bytes: file.size };
  }
  const fields: Record<string, string> = {};
  for (const [key, value] of Object.entries((req.body ?? {}) as Record<string, unknown>)) {
    if (typeof value === 'string') fields[key] = value;
    else if (Array.isArray(value) && typeof value[0] === 'string') fields[key] = value[0];
  }
  return { dir, files, fields, cleanup };
}

function uploadError(error: unknown, options: ReceiveOptions): unknown {
  if (error instanceof MulterError) {
    const field = error.field ?? 'file';
    switch (error.code) {
      case 'LIMIT_FILE_SIZE':
        return options.tooLarge(field);
      case 'LIMIT_UNEXPECTED_FILE':
      case 'LIMIT_FILE_COUNT':
        return AppError.badRequest(`Unexpected file in “${field}”: send one file each in ${options.fileFields.join(', ')}.`, {
          [field]: `Not expected here; use the fields ${options.fileFields.join(', ')}, one file each.`,
        });
      default:
        return AppError.badRequest(`The upload was refused: ${error.message}.`, { [field]: error.message });
    }
  }
  if (error instanceof Error && !(error instanceof AppError)) {
    return new AppError(400, 'malformed_upload', `The upload could not be read (${error.message}). Try again.`, undefined, {
      cause: error,
    });
  }
  return error;
}
