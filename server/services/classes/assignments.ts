import type { Transaction } from 'sequelize';
import type { ServerConfig } from '../../config';
import { Assignment, AssignmentCopy, ClassGroup, Feedback, HandIn, Sketch, User, type PublicUser } from '../../models';
import { HttpError, badRequest, conflict, forbidden, notFound } from '../../middleware/http-error';
import type {
  AssignmentCopy as AssignmentCopyAnswer,
  AssignmentDetail,
  CreateAssignmentBody,
  HandInDetail,
  HandInRow,
  KeyNumber,
  UpdateAssignmentBody,
} from '../../../shared/schema/classes';
import { createAssignmentBody } from '../../../shared/schema/classes';
import type { Sketch as SketchDocument } from '../../../shared/schema/sketch';
import { readTargets } from '../../../shared/display/targets';
import { sweepOnce } from '../../../shared/sheet/sweepOnce';
import { handInNumbers } from '../../../shared/classes/handInNumbers';
import type { Mailer } from '../mail/mailer';
import { feedbackMail } from '../mail/messages';
import { createSketch } from '../sketches';
import { assertOpen, classFor, type ClassRole } from './access';

function transaction<T>(work: (t: Transaction) => Promise<T>): Promise<T> {
  return Assignment.sequelize!.transaction(work);
}

const noSuchAssignment = () => notFound('no such assignment');
const noSuchHandIn = () => notFound('no such hand-in');

/** Turns a 404 of the enclosing record into the 404 of the one asked for; other errors pass. */
const asNotFound =
  (make: () => HttpError) =>
  (err: unknown): never => {
    throw err instanceof HttpError && err.status === 404 ? make() : err;
  };

interface AssignmentAccess {
  assignment: Assignment;
  klass: ClassGroup;
  role: ClassRole;
}

/** The assignment and the caller's role in its class; 404 for anyone outside the class (a removed student too). */
async function assignmentFor(user: PublicUser, id: number, t?: Transaction): Promise<AssignmentAccess> {
  const assignment = await Assignment.findByPk(id, { transaction: t });
  if (!assignment) throw noSuchAssignment();
  const { klass, role } = await classFor(user, assignment.classId, { t }).catch(asNotFound(noSuchAssignment));
  return { assignment, klass, role };
}

/** A due date as the API takes it: 400 naming dueAt unless it lies in the future. */
function futureDueAt(dueAt: string): Date {
  const due = new Date(dueAt);
  if (!(due.getTime() > Date.now())) {
    throw badRequest(`dueAt must lie in the future; ${dueAt} has passed`, [`dueAt: ${dueAt} is not in the future`]);
  }
  return due;
}

/** The starter's target bands, or none when the assignment leaves them out. */
function assignmentTargets(assignment: Assignment): SketchDocument['targets'] {
  if (!assignment.withTargets) return undefined;
  return (JSON.parse(assignment.starterDocument) as SketchDocument).targets;
}

/** Makes an assignment from one of the instructor's own live sketches; its document is kept as it is now. */
export async function createAssignment(
  user: PublicUser,
  classId: number,
  input: CreateAssignmentBody,
): Promise<AssignmentDetail> {
  const body = createAssignmentBody.parse(input);
  const { klass, role } = await classFor(user, classId);
  if (role !== 'instructor') throw forbidden('only the instructor of this class may set assignments');
  assertOpen(klass, 'it takes no new assignments');
  const dueAt = futureDueAt(body.dueAt);
  const starter = await Sketch.findOne({ where: { id: body.sketchId, ownerId: user.id, deletedAt: null } });
  if (!starter) throw notFound(`sketchId: no sketch ${body.sketchId} among your own`);
  const doc = JSON.parse(starter.document) as SketchDocument;
  // JSON leaves out a field set to undefined: without targets, the copies carry no bands.
  const starterDocument = JSON.stringify(body.withTargets ? doc : { ...doc, targets: undefined });
  const assignment = await Assignment.create({
    classId: klass.id,
    starterSketchId: starter.id,
    starterDocument,
    title: body.title,
    instructions: body.instructions,
    dueAt,
    withTargets: body.withTargets,
  });
  return getAssignment(user, assignment.id);
}

function feedbackOf(handIn: HandIn): HandInRow['feedback'] {
  const f = (handIn as HandIn & { feedback?: Feedback & { author?: User } }).feedback;
  if (!f) return null;
  return {
    text: f.text,
    writtenAt: f.updatedAt.toISOString(),
    author: { id: f.authorId ?? 0, name: f.author?.name ?? '' },
  };
}

function rowOf(h: HandIn): HandInRow {
  const student = (h as HandIn & { student?: User }).student;
  return {
    id: h.id,
    assignmentId: h.assignmentId,
    student: { id: h.studentId, name: student?.name ?? '' },
    sketchId: h.sketchId,
    version: h.version,
    handedInAt: h.handedInAt.toISOString(),
    late: h.late,
    keyNumbers: JSON.parse(h.keyNumbers) as KeyNumber[],
    flagCount: h.flagCount,
    missedTargetCount: h.missedTargetCount,
    problem: h.problem,
    feedback: feedbackOf(h),
  };
}

const handInIncludes = [
  { model: User, as: 'student', attributes: ['id', 'name'] },
  {
    model: Feedback,
    as: 'feedback',
    required: false,
    include: [{ model: User, as: 'author', attributes: ['id', 'name'] }],
  },
];

/** The newest hand-in of each student among `rows` (sorted newest first). */
function latestPerStudent(rows: HandIn[]): HandIn[] {
  const seen = new Set<number>();
  return rows.filter((h) => (seen.has(h.studentId) ? false : (seen.add(h.studentId), true)));
}

/**
 * The hand-ins the caller sees: the instructor the latest of each student; a student every one of their own
 * (with the feedback on each) and, once the assignment is published, the latest of each classmate.
 */
async function visibleHandIns(access: AssignmentAccess, user: PublicUser, t?: Transaction): Promise<HandIn[]> {
  const { assignment, role } = access;
  const rows = await HandIn.findAll({
    where: { assignmentId: assignment.id },
    include: handInIncludes,
    order: [
      ['handedInAt', 'DESC'],
      ['id', 'DESC'],
    ],
    transaction: t,
  });
  if (role === 'instructor') return latestPerStudent(rows);
  const own = rows.filter((h) => h.studentId === user.id);
  if (!assignment.published) return own;
  return [...own, ...latestPerStudent(rows.filter((h) => h.studentId !== user.id))];
}

/** The caller's live copy of the assignment, or null. */
async function liveCopy(assignmentId: number, studentId: number, t?: Transaction) {
  const copy = await AssignmentCopy.findOne({ where: { assignmentId, studentId }, transaction: t });
  if (!copy) return null;
  const sketch = await Sketch.findOne({
    where: { id: copy.sketchId, ownerId: studentId, deletedAt: null },
    transaction: t,
  });
  return sketch ? { copy, sketch } : null;
}

async function detailOf(access: AssignmentAccess, user: PublicUser): Promise<AssignmentDetail> {
  const { assignment, klass, role } = access;
  const copy = role === 'student' ? await liveCopy(assignment.id, user.id) : null;
  return {
    id: assignment.id,
    classId: klass.id,
    className: klass.name,
    classClosed: !!klass.closedAt,
    role,
    title: assignment.title,
    instructions: assignment.instructions,
    dueAt: assignment.dueAt.toISOString(),
    published: assignment.published,
    createdAt: assignment.createdAt.toISOString(),
    starterSketchId: assignment.starterSketchId,
    copy: copy ? { sketchId: copy.sketch.id, createdAt: copy.copy.createdAt.toISOString() } : null,
    handIns: (await visibleHandIns(access, user)).map(rowOf),
  };
}

export async function getAssignment(user: PublicUser, id: number): Promise<AssignmentDetail> {
  return detailOf(await assignmentFor(user, id), user);
}

/**
 * The instructor changes the title, instructions, due date (again only to a future one) or publishes the
 * hand-ins. A closed class is read-only, except that its hand-ins may still be published or hidden.
 */
export async function updateAssignment(
  user: PublicUser,
  id: number,
  body: UpdateAssignmentBody,
): Promise<AssignmentDetail> {
  const access = await assignmentFor(user, id);
  if (access.role !== 'instructor') throw forbidden('only the instructor of this class may change its assignments');
  const { published, ...rest } = body;
  if (Object.values(rest).some((v) => v !== undefined)) assertOpen(access.klass, 'its assignments cannot be changed');
  const { assignment } = access;
  if (body.title !== undefined) assignment.title = body.title;
  if (body.instructions !== undefined) assignment.instructions = body.instructions;
  if (body.dueAt !== undefined) assignment.dueAt = futureDueAt(body.dueAt);
  if (published !== undefined) assignment.published = published;
  await assignment.save();
  return detailOf(access, user);
}

function copyName(title: string, studentName: string): string {
  return `${title} (${studentName})`.slice(0, 200);
}

/**
 * A student's own copy of the starter: a normal sketch they own, made once (asking again gives the same
 * copy; a copy they deleted is replaced by a new one).
 */
export async function copyAssignment(
  user: PublicUser,
  id: number,
): Promise<{ copy: AssignmentCopyAnswer; created: boolean }> {
  const { assignment, klass, role } = await assignmentFor(user, id);
  if (role !== 'student') throw forbidden('copies are for the students of the class; the instructor has the starter');
  const existing = await liveCopy(assignment.id, user.id);
  if (existing)
    return { copy: { sketchId: existing.sketch.id, createdAt: existing.copy.createdAt.toISOString() }, created: false };
  assertOpen(klass, 'no new copies can be made');
  const doc = JSON.parse(assignment.starterDocument) as SketchDocument;
  const sketch = await createSketch(user, { ...doc, name: copyName(assignment.title, user.name) });
  const copy = await transaction(async (t) => {
    const row = await AssignmentCopy.findOne({
      where: { assignmentId: assignment.id, studentId: user.id },
      transaction: t,
    });
    if (row) return row.update({ sketchId: sketch.id }, { transaction: t });
    return AssignmentCopy.create(
      { assignmentId: assignment.id, studentId: user.id, sketchId: sketch.id },
      { transaction: t },
    );
  });
  return { copy: { sketchId: sketch.id, createdAt: copy.updatedAt.toISOString() }, created: true };
}

/**
 * Hands in the copy's current saved version: the document is stored with the hand-in, frozen, and its key
 * numbers are read from a sweep now (against the assignment's target bands when it has them, else the copy's
 * own). Handing in again adds a new hand-in; one after the due date is accepted and marked late; a closed
 * class takes none.
 */
export async function handIn(user: PublicUser, id: number): Promise<HandInRow> {
  const { assignment, klass, role } = await assignmentFor(user, id);
  if (role !== 'student') throw forbidden('hand-ins are for the students of the class');
  assertOpen(klass, 'it takes no more hand-ins');
  const live = await liveCopy(assignment.id, user.id);
  if (!live) throw conflict('you have no copy of this assignment to hand in; start your copy first');
  const row = await recordHandIn(assignment, user.id, live.sketch, new Date());
  return rowOf(await HandIn.findByPk(row.id, { include: handInIncludes, rejectOnEmpty: true }));
}

/**
 * Stores a hand-in of `sketch` (its saved version) made at `at`: the document frozen, late when after the due
 * date, and its key numbers read from a sweep now, against the assignment's target bands when it has them,
 * else the sketch's own. A sketch that cannot be swept is handed in all the same, with the problem kept.
 */
export async function recordHandIn(
  assignment: Assignment,
  studentId: number,
  sketch: Sketch,
  at: Date,
): Promise<HandIn> {
  const document = JSON.parse(sketch.document) as SketchDocument;
  const swept = sweepOnce(document);
  const targets = readTargets(assignment.withTargets ? { targets: assignmentTargets(assignment) } : document);
  const numbers = swept.result ? handInNumbers(document, swept.result, targets) : null;
  return HandIn.create({
    assignmentId: assignment.id,
    studentId,
    sketchId: sketch.id,
    version: sketch.version,
    document: sketch.document,
    handedInAt: at,
    late: at.getTime() > assignment.dueAt.getTime(),
    keyNumbers: JSON.stringify(numbers?.keyNumbers ?? []),
    flagCount: numbers?.flagCount ?? 0,
    missedTargetCount: numbers?.missedTargetCount ?? 0,
    problem: swept.problem,
  });
}

interface HandInAccess extends AssignmentAccess {
  handIn: HandIn;
}

/**
 * A hand-in for its class's instructor, for the student who handed it in while they are in the class, and
 * for the other students once the assignment is published; 404 for everyone else.
 */
async function handInFor(user: PublicUser, id: number): Promise<HandInAccess> {
  const row = await HandIn.findByPk(id, { include: handInIncludes });
  if (!row) throw noSuchHandIn();
  const access = await assignmentFor(user, row.assignmentId).catch(asNotFound(noSuchHandIn));
  const sees = access.role === 'instructor' || row.studentId === user.id || access.assignment.published;
  if (!sees) throw noSuchHandIn();
  return { ...access, handIn: row };
}

/** The frozen document of a hand-in, read-only, with its row. */
export async function getHandIn(user: PublicUser, id: number): Promise<HandInDetail> {
  const { handIn: row, assignment, klass } = await handInFor(user, id);
  return {
    ...rowOf(row),
    assignmentTitle: assignment.title,
    classId: klass.id,
    document: JSON.parse(row.document) as SketchDocument,
  };
}

/** The instructor writes (or rewrites) the feedback on a hand-in; it is stored, then mailed to the student. */
export async function writeFeedback(
  user: PublicUser,
  id: number,
  text: string,
  config: ServerConfig,
  mailer: Mailer,
): Promise<HandInRow> {
  const { handIn: row, assignment, role } = await handInFor(user, id);
  if (role !== 'instructor') throw forbidden('only the instructor of this class may write feedback');
  await transaction(async (t) => {
    const existing = await Feedback.findOne({ where: { handInId: row.id }, transaction: t });
    if (existing) await existing.update({ text, authorId: user.id }, { transaction: t });
    else await Feedback.create({ handInId: row.id, authorId: user.id, text }, { transaction: t });
  });
  const student = await User.findByPk(row.studentId, { attributes: ['email', 'name'] });
  if (student) {
    // Queued, not awaited: the feedback is kept whatever becomes of the mail (a failed send is retried and logged).
    mailer.queue(
      feedbackMail(config, {
        to: { email: student.email, name: student.name },
        instructor: user.name,
        assignmentId: assignment.id,
        title: assignment.title,
        text,
      }),
    );
  }
  const fresh = await HandIn.findByPk(row.id, { include: handInIncludes, rejectOnEmpty: true });
  return rowOf(fresh);
}
