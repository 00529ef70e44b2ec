/**
 * What the HTTP API answers: one shape per answer, used by the server that builds it and the client
 * that reads it. Objects are strict, so a field added on one side and not here fails the API tests
 * that parse real answers with these schemas. Times are ISO 8601 strings; ids are integers.
 */
import { z } from 'zod';
import { roles } from './accounts';
import { sketchSchema } from './sketch';
import { shareModes } from './sketchRequests';

const id = z.number().int().positive();
const isoTime = z.iso.datetime();

/** The account as the API shows it (never the password hash). */
export const publicUserSchema = z.strictObject({
  id,
  email: z.string(),
  name: z.string(),
  role: z.enum(roles),
});
export type PublicUser = z.infer<typeof publicUserSchema>;

/** One row of the library list. `mine` is the caller's own sketch; `deletedAt` is set while it sits in the bin. */
export const sketchSummarySchema = z.strictObject({
  id,
  name: z.string(),
  layout: z.string(),
  version: z.number().int().positive(),
  updatedAt: isoTime,
  createdAt: isoTime,
  owner: z.strictObject({ id, name: z.string() }),
  mine: z.boolean(),
  share: z.enum(shareModes),
  deletedAt: isoTime.nullable(),
});
export type SketchSummary = z.infer<typeof sketchSummarySchema>;

/** One sketch with its document: what GET /api/sketches/:id and every change to a sketch answer. */
export const sketchDetailSchema = sketchSummarySchema.extend({
  document: sketchSchema,
  canEdit: z.boolean(),
  /** the share link's token, shown to the owner only */
  shareToken: z.string().nullable(),
});
export type SketchDetail = z.infer<typeof sketchDetailSchema>;

/** One page of a list: its items, how many there are in all, and which page of which size this is. */
export function pageSchema<T extends z.ZodType>(item: T) {
  return z.strictObject({
    items: z.array(item),
    total: z.number().int().nonnegative(),
    page: z.number().int().positive(),
    pageSize: z.number().int().positive(),
  });
}
export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

/** GET /api/sketches: one page of the library. */
export const sketchPageSchema = pageSchema(sketchSummarySchema);

/** One e-mail of a sketch's read-only link. `live`: the link it carried still works (not revoked since). */
export const shareRecipientSchema = z.strictObject({
  email: z.string(),
  sentAt: isoTime,
  live: z.boolean(),
});
export type ShareRecipient = z.infer<typeof shareRecipientSchema>;

/**
 * GET and POST /api/sketches/:id/share: whether the read-only link is on, the link itself (an absolute address
 * under PUBLIC_URL, null while private) and who it was mailed to, newest first.
 */
export const shareStateSchema = z.strictObject({
  share: z.enum(shareModes),
  shareToken: z.string().nullable(),
  url: z.string().nullable(),
  recipients: z.array(shareRecipientSchema),
});
export type ShareState = z.infer<typeof shareStateSchema>;

/** One saved version of a sketch, as the history lists it. */
export const revisionSchema = z.strictObject({
  rev: z.number().int().positive(),
  version: z.number().int().positive(),
  name: z.string(),
  createdAt: isoTime,
});
export type Revision = z.infer<typeof revisionSchema>;

/** GET /api/sketches/:id/revisions: every revision, newest first. */
export const revisionListSchema = z.strictObject({ items: z.array(revisionSchema) });
export type RevisionList = z.infer<typeof revisionListSchema>;

/** GET /api/sketches/:id/revisions/:rev: one revision with the document it saved (as stored, not re-checked). */
export const revisionDetailSchema = revisionSchema.extend({ document: z.unknown() });
export type RevisionDetail = z.infer<typeof revisionDetailSchema>;

/** POST /api/sketches/:id/uploads: the stored image. */
export const uploadInfoSchema = z.strictObject({
  id: z.string(),
  /** where the bytes are served, '/api/uploads/:id' */
  url: z.string(),
  mime: z.string(),
  /** bytes */
  size: z.number().int().nonnegative(),
});
export type UploadInfo = z.infer<typeof uploadInfoSchema>;

/** One account in the admin list. */
export const adminUserSchema = publicUserSchema.extend({ disabled: z.boolean(), createdAt: isoTime });
export type AdminUser = z.infer<typeof adminUserSchema>;

/** One message of the admin mail log. */
export const outboxMessageSchema = z.strictObject({
  id,
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  sentAt: isoTime,
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;
