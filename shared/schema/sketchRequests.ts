import { z } from 'zod';
import { layouts } from './sketch';
import { emailField } from './accounts';
import { MAX_NAME_LENGTH } from './sketchVocabulary';

/** Who may open a sketch besides its owner: nobody, or anyone with the link ('class' comes with classes). */
export const shareModes = ['private', 'link'] as const;
export type ShareMode = (typeof shareModes)[number];

export const PAGE_SIZE_MAX = 100;

/** A sketch's name in a request: the same bound as the sketch file's `name`. */
const nameField = z.string().trim().min(1, 'must not be empty').max(MAX_NAME_LENGTH);

export const createSketchBody = z.strictObject({
  name: nameField.optional(),
  document: z.unknown(),
});

export const updateSketchBody = z.strictObject({
  document: z.unknown(),
  name: nameField.optional(),
  version: z.int('must be a whole number').positive(),
});

/**
 * POST /api/sketches/:id/share: turn the read-only link on ('link') or revoke it ('private'); with `email`, also
 * mail the link to that one address (only with the link on: a revoked link cannot be sent).
 */
export const shareBody = z
  .strictObject({
    mode: z.enum(shareModes),
    email: emailField.optional(),
  })
  .refine((b) => b.email === undefined || b.mode === 'link', {
    path: ['email'],
    message: "a link can only be sent with mode 'link'",
  });
export type ShareBody = z.infer<typeof shareBody>;

const flag = z
  .enum(['0', '1'])
  .default('0')
  .transform((v) => v === '1');

export const listQuery = z.object({
  q: z.string().trim().max(MAX_NAME_LENGTH).default(''),
  layout: z.enum(layouts).optional(),
  sort: z.enum(['name', 'layout', 'updatedAt']).default('updatedAt'),
  order: z.enum(['asc', 'desc']).default('desc'),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(PAGE_SIZE_MAX).default(20),
  deleted: flag,
});
export type ListQuery = z.infer<typeof listQuery>;

/** The build sheet PDF's query: the paper it is laid out for and the unit of its lengths. */
export const buildSheetQuery = z.strictObject({
  paper: z.enum(['a4', 'letter'], { error: 'expected a4 or letter' }).default('a4'),
  units: z.enum(['mm', 'in'], { error: 'expected mm or in' }).default('mm'),
});
export type BuildSheetQuery = z.infer<typeof buildSheetQuery>;
/**
 * The library list's query as the client keeps it between pages: the fields of `listQuery`, with "any layout"
 * held as null (a select's empty value) and without the bin flag, which the library list never sends.
 */
export type LibraryQuery = Omit<ListQuery, 'layout' | 'deleted'> & { layout: NonNullable<ListQuery['layout']> | null };
