/**
 * Classes: what the classes API takes and answers. One instructor runs a class; students join it by an
 * e-mailed invitation or its join code; an assignment hands every student a copy of one of the instructor's
 * sketches; a hand-in freezes one version of that copy; feedback is written per hand-in.
 *
 * Routes (all JSON; state-changing ones carry the CSRF token as every other route does):
 * - POST   /api/classes                          createClassBody → 201 ClassDetail (instructors and admins)
 * - GET    /api/classes                          → ClassList (taught by or joined by the caller)
 * - GET    /api/classes/:id                      → ClassDetail (roster and invitations for its instructor only)
 * - PATCH  /api/classes/:id                      updateClassBody → ClassDetail (rename, close, reopen)
 * - DELETE /api/classes/:id                      → ClassDetail with deletedAt set (undo: POST …/restore)
 * - POST   /api/classes/:id/restore              → ClassDetail
 * - DELETE /api/classes/:id/members/:userId      → 204 (the instructor removes a student)
 * - POST   /api/classes/:id/leave                → 204 (a student leaves)
 * - POST   /api/classes/:id/invites              inviteBody → InviteResult
 * - POST   /api/classes/:id/invites/:inviteId/resend   → ClassInvite (a new token, a new mail)
 * - DELETE /api/classes/:id/invites/:inviteId          → 204 (withdrawn: its link stops working)
 * - GET    /api/invites/:token                   → InvitePreview (signed out too: what the link is for)
 * - POST   /api/invites/:token/accept            → JoinResult (signed in; the invitation is used up)
 * - POST   /api/classes/join                     joinBody → JoinResult
 * - POST   /api/classes/:id/assignments          createAssignmentBody → 201 AssignmentDetail
 * - GET    /api/assignments/:id                  → AssignmentDetail
 * - PATCH  /api/assignments/:id                  updateAssignmentBody → AssignmentDetail
 * - POST   /api/assignments/:id/copy             → 201 (or 200 when it exists) AssignmentCopy
 * - POST   /api/assignments/:id/hand-ins         → 201 HandInRow (the copy's current saved version, frozen)
 * - GET    /api/hand-ins/:id                     → HandInDetail (the frozen document, read-only)
 * - POST   /api/hand-ins/:id/feedback            feedbackBody → HandInRow (and a mail to the student)
 */
import { z } from 'zod';
import { sketchSchema } from './sketch';

const id = z.number().int().positive();
const isoTime = z.iso.datetime();

/** Limits on what a class holds (characters, addresses). */
export const CLASS_NAME_MAX = 120;
export const CLASS_TERM_MAX = 60;
export const INVITES_PER_REQUEST_MAX = 500;
export const INSTRUCTIONS_MAX = 10_000;
export const FEEDBACK_MAX = 10_000;
export const ASSIGNMENT_TITLE_MAX = 120;
/** How long an invitation's link works (days). */
export const INVITE_TTL_DAYS = 14;

const className = z.string().trim().min(1, 'must not be empty').max(CLASS_NAME_MAX);
const term = z.string().trim().max(CLASS_TERM_MAX);

export const createClassBody = z.strictObject({ name: className, term: term.optional() });
export type CreateClassBody = z.infer<typeof createClassBody>;

/** Rename, change the term, close (read-only, still listed) or reopen. */
export const updateClassBody = z.strictObject({
  name: className.optional(),
  term: term.nullable().optional(),
  closed: z.boolean().optional(),
});
export type UpdateClassBody = z.infer<typeof updateClassBody>;

/**
 * A pasted list of addresses: one string (split on commas, semicolons, spaces and new lines) or an array.
 * Each address is checked on its own on the server, so one bad address never stops the others.
 */
export const inviteBody = z.strictObject({
  emails: z.union([z.string().max(100_000), z.array(z.string().max(1000)).max(INVITES_PER_REQUEST_MAX)]),
});
export type InviteBody = z.infer<typeof inviteBody>;

/** A join code as a student types it: letters and digits, case and spaces ignored. */
export const joinBody = z.strictObject({ joinCode: z.string().trim().min(1, 'must not be empty').max(40) });

export const createAssignmentBody = z.strictObject({
  /** one of the instructor's own sketches: the starter every student copies */
  sketchId: id,
  title: z.string().trim().min(1, 'must not be empty').max(ASSIGNMENT_TITLE_MAX),
  instructions: z.string().max(INSTRUCTIONS_MAX).default(''),
  /** ISO 8601; must lie in the future when the assignment is made */
  dueAt: isoTime,
  /** copy the starter sketch's target bands into every student's copy */
  withTargets: z.boolean().default(true),
});
export type CreateAssignmentBody = z.input<typeof createAssignmentBody>;

export const updateAssignmentBody = z.strictObject({
  title: z.string().trim().min(1, 'must not be empty').max(ASSIGNMENT_TITLE_MAX).optional(),
  instructions: z.string().max(INSTRUCTIONS_MAX).optional(),
  dueAt: isoTime.optional(),
  /** show every student's hand-ins to the whole class */
  published: z.boolean().optional(),
});
export type UpdateAssignmentBody = z.infer<typeof updateAssignmentBody>;

export const feedbackBody = z.strictObject({ text: z.string().trim().min(1, 'must not be empty').max(FEEDBACK_MAX) });

// ---- answers ----

const person = z.strictObject({ id, name: z.string() });

/** One class in the caller's list. `role`: the caller teaches it or is a student in it. */
export const classSummarySchema = z.strictObject({
  id,
  name: z.string(),
  term: z.string().nullable(),
  role: z.enum(['instructor', 'student']),
  instructor: person,
  closed: z.boolean(),
  deletedAt: isoTime.nullable(),
  studentCount: z.number().int().nonnegative(),
  assignmentCount: z.number().int().nonnegative(),
  /** for a student: the earliest due date of an assignment not yet handed in, else null */
  nextDueAt: isoTime.nullable(),
  createdAt: isoTime,
});
export type ClassSummary = z.infer<typeof classSummarySchema>;

export const classListSchema = z.strictObject({ items: z.array(classSummarySchema) });
export type ClassList = z.infer<typeof classListSchema>;

export const classMemberSchema = z.strictObject({ id, name: z.string(), email: z.string(), joinedAt: isoTime });
export type ClassMemberRow = z.infer<typeof classMemberSchema>;

export const inviteStates = ['pending', 'accepted', 'expired', 'withdrawn'] as const;
export type InviteState = (typeof inviteStates)[number];

export const classInviteSchema = z.strictObject({
  id,
  email: z.string(),
  state: z.enum(inviteStates),
  sentAt: isoTime,
  expiresAt: isoTime,
  acceptedAt: isoTime.nullable(),
});
export type ClassInvite = z.infer<typeof classInviteSchema>;

/** One assignment as a class page lists it; `handedIn` is the caller's own (students), `handInCount` all (instructor). */
export const assignmentSummarySchema = z.strictObject({
  id,
  title: z.string(),
  dueAt: isoTime,
  published: z.boolean(),
  handInCount: z.number().int().nonnegative(),
  handedIn: z.boolean(),
});
export type AssignmentSummary = z.infer<typeof assignmentSummarySchema>;

export const classDetailSchema = classSummarySchema.extend({
  /** shown to its instructor (and admins) only; students get null */
  joinCode: z.string().nullable(),
  members: z.array(classMemberSchema).nullable(),
  invites: z.array(classInviteSchema).nullable(),
  assignments: z.array(assignmentSummarySchema),
});
export type ClassDetail = z.infer<typeof classDetailSchema>;

/** What POST /api/classes/:id/invites did with each address of the list. */
export const inviteResultSchema = z.strictObject({
  sent: z.array(classInviteSchema),
  /** addresses refused, each with why ("not an e-mail address", "already in the class", …) */
  refused: z.array(z.strictObject({ email: z.string(), problem: z.string() })),
  /** addresses sent nothing because the list named them twice or they already hold a pending invitation */
  skipped: z.array(z.strictObject({ email: z.string(), reason: z.string() })),
});
export type InviteResult = z.infer<typeof inviteResultSchema>;

export const invitePreviewSchema = z.strictObject({
  className: z.string(),
  instructorName: z.string(),
  email: z.string(),
  state: z.enum(inviteStates),
  expiresAt: isoTime,
});
export type InvitePreview = z.infer<typeof invitePreviewSchema>;

export const joinResultSchema = z.strictObject({ classId: id, className: z.string() });
export type JoinResult = z.infer<typeof joinResultSchema>;

/** One key number of a hand-in, read from the registry when it was handed in. */
export const keyNumberSchema = z.strictObject({
  /** the registry's key, e.g. 'antiSquat' */
  key: z.string(),
  label: z.string(),
  /** 'ride' | 'bump' | 'droop' | 'articulation' */
  at: z.string(),
  /** in the registry's base unit (mm, degrees, %), null where not defined */
  value: z.number().nullable(),
  unit: z.string(),
});
export type KeyNumber = z.infer<typeof keyNumberSchema>;

export const feedbackSchema = z.strictObject({ text: z.string(), writtenAt: isoTime, author: person });

export const handInRowSchema = z.strictObject({
  id,
  assignmentId: id,
  student: person,
  /** the copy's sketch id and the frozen version */
  sketchId: id,
  version: z.number().int().positive(),
  handedInAt: isoTime,
  late: z.boolean(),
  keyNumbers: z.array(keyNumberSchema),
  flagCount: z.number().int().nonnegative(),
  missedTargetCount: z.number().int().nonnegative(),
  /** why the key numbers are missing (the sketch could not be swept), else null */
  problem: z.string().nullable(),
  feedback: feedbackSchema.nullable(),
});
export type HandInRow = z.infer<typeof handInRowSchema>;

export const handInDetailSchema = handInRowSchema.extend({
  assignmentTitle: z.string(),
  classId: id,
  document: sketchSchema,
});
export type HandInDetail = z.infer<typeof handInDetailSchema>;

/** A student's own copy of an assignment's starter. */
export const assignmentCopySchema = z.strictObject({ sketchId: id, createdAt: isoTime });
export type AssignmentCopy = z.infer<typeof assignmentCopySchema>;

export const assignmentDetailSchema = z.strictObject({
  id,
  classId: id,
  className: z.string(),
  classClosed: z.boolean(),
  role: z.enum(['instructor', 'student']),
  title: z.string(),
  instructions: z.string(),
  dueAt: isoTime,
  published: z.boolean(),
  createdAt: isoTime,
  /** the instructor's sketch it was made from */
  starterSketchId: id,
  /** the caller's copy (students), null before they start */
  copy: assignmentCopySchema.nullable(),
  /** instructor: every hand-in; student: their own, or everyone's once published */
  handIns: z.array(handInRowSchema),
});
export type AssignmentDetail = z.infer<typeof assignmentDetailSchema>;
