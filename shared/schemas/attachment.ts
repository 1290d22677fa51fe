import { z } from 'zod';
import { PageQuerySchema, pageOf } from './list';
import { SeenVersionSchema } from './seen-version';

/** What an attachment belongs to. */
export const ATTACHMENT_OWNER_TYPES = ['post', 'site', 'plan'] as const;
export type AttachmentOwnerType = (typeof ATTACHMENT_OWNER_TYPES)[number];

/** A photo is a view from somewhere (it may carry a bearing); a document is anything else kept with the owner. */
export const ATTACHMENT_KINDS = ['photo', 'document'] as const;
export type AttachmentKind = (typeof ATTACHMENT_KINDS)[number];

export const MEBIBYTE = 1024 * 1024;

/** Largest photo accepted: 15 MB (15 × 1 048 576 bytes). */
export const PHOTO_MAX_BYTES = 15 * MEBIBYTE;
/** Largest document accepted: 25 MB (25 × 1 048 576 bytes). */
export const DOCUMENT_MAX_BYTES = 25 * MEBIBYTE;

export const MAX_BYTES: Record<AttachmentKind, number> = { photo: PHOTO_MAX_BYTES, document: DOCUMENT_MAX_BYTES };

/** Image types a photo may have (checked from the bytes, not the name). */
export const PHOTO_CONTENT_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
/** Types a document may have: PDF, UTF-8 text, CSV, or one of the image types. */
export const DOCUMENT_CONTENT_TYPES = ['application/pdf', 'text/plain', 'text/csv', ...PHOTO_CONTENT_TYPES] as const;
export type AttachmentContentType = (typeof DOCUMENT_CONTENT_TYPES)[number];

export const ALLOWED_CONTENT_TYPES: Record<AttachmentKind, readonly AttachmentContentType[]> = {
  photo: PHOTO_CONTENT_TYPES,
  document: DOCUMENT_CONTENT_TYPES,
};

/** What each kind accepts, in words (error messages, the upload panel, README). */
export const ACCEPTS: Record<AttachmentKind, string> = {
  photo: 'JPEG, PNG or WebP, at most 15 MB',
  document: 'PDF, plain text (UTF-8), CSV, JPEG, PNG or WebP, at most 25 MB',
};

export const CAPTION_MAX = 500;

const bearing = z
  .number({ error: 'A bearing is a number of degrees.' })
  .min(0, 'Bearings run 0–360°.')
  .max(360, 'Bearings run 0–360°.');

const caption = z.string({ error: 'A caption is text.' }).trim().max(CAPTION_MAX, `At most ${CAPTION_MAX} characters.`);

/** A file kept with a post, a site or a plan. Sizes in bytes, image sizes in pixels. */
export const AttachmentSchema = z.object({
  id: z.uuid(),
  ownerType: z.enum(ATTACHMENT_OWNER_TYPES),
  ownerId: z.uuid(),
  kind: z.enum(ATTACHMENT_KINDS),
  /** The name the file had on the uploader's device. */
  originalName: z.string(),
  /** Sniffed from the bytes at upload, not taken from the uploader. */
  contentType: z.enum(DOCUMENT_CONTENT_TYPES),
  bytes: z.number().int(),
  /** sha256 of the bytes, hex. */
  sha256: z.string(),
  /** Image size as displayed (EXIF rotation applied), pixels; null for non-images. */
  widthPx: z.number().int().nullable(),
  heightPx: z.number().int().nullable(),
  /** The direction a photo looks, degrees clockwise from true north; null when not given. */
  bearingDeg: z.number().nullable(),
  caption: z.string(),
  uploadedBy: z.object({ id: z.uuid(), name: z.string() }),
  /** ISO 8601. */
  createdAt: z.string(),
  updatedAt: z.string(),
  version: z.number().int(),
});
export type Attachment = z.infer<typeof AttachmentSchema>;

/** Multipart text fields sent beside the file (all strings on the wire). */
export const AttachmentUploadFieldsSchema = z
  .object({
    ownerType: z.enum(ATTACHMENT_OWNER_TYPES, { error: `Choose one of: ${ATTACHMENT_OWNER_TYPES.join(', ')}.` }),
    ownerId: z.uuid({ error: 'Not an id.' }),
    kind: z.enum(ATTACHMENT_KINDS, { error: `Choose one of: ${ATTACHMENT_KINDS.join(', ')}.` }),
    caption: caption.default(''),
    bearingDeg: z.preprocess(
      (v) => (v === undefined || v === null || (typeof v === 'string' && v.trim() === '') ? null : Number(v)),
      bearing.nullable(),
    ),
  })
  .refine((f) => f.kind === 'photo' || f.bearingDeg === null, {
    path: ['bearingDeg'],
    message: 'Only photos have a bearing.',
  });
export type AttachmentUploadFields = z.infer<typeof AttachmentUploadFieldsSchema>;

export const AttachmentUpdateSchema = z.object({
  caption: caption.optional(),
  bearingDeg: bearing.nullable().optional(),
  version: SeenVersionSchema,
});
export type AttachmentUpdate = z.infer<typeof AttachmentUpdateSchema>;

export const AttachmentListQuerySchema = PageQuerySchema.extend({
  ownerType: z.enum(ATTACHMENT_OWNER_TYPES, { error: `Choose one of: ${ATTACHMENT_OWNER_TYPES.join(', ')}.` }),
  ownerId: z.uuid({ error: 'Not an id.' }),
  kind: z.enum(ATTACHMENT_KINDS, { error: `Choose one of: ${ATTACHMENT_KINDS.join(', ')}.` }).optional(),
});
export type AttachmentListQuery = z.infer<typeof AttachmentListQuerySchema>;

export const AttachmentListSchema = pageOf(AttachmentSchema);
export type AttachmentList = z.infer<typeof AttachmentListSchema>;
