import { Op, type Transaction } from 'sequelize';
import { Assignment, ClassGroup, ClassInvite, ClassMember, HandIn, User, type PublicUser } from '../../models';
import { conflict, forbidden, notFound } from '../../middleware/http-error';
import type {
  AssignmentSummary,
  ClassDetail,
  ClassList,
  ClassSummary,
  CreateClassBody,
  UpdateClassBody,
} from '../../../shared/schema/classes';
import { classFor, taughtClass, type ClassRole } from './access';
import { inviteRowOf } from './inviteRows';
import { newJoinCode } from './joinCode';
import { RESTORE_WINDOW_MS } from '../sketches';

function transaction<T>(work: (t: Transaction) => Promise<T>): Promise<T> {
  return ClassGroup.sequelize!.transaction(work);
}

const iso = (d: Date | null | undefined) => (d ? d.toISOString() : null);

/** Distinct students who handed in the assignment at least once. */
async function studentsHandedIn(assignmentId: number, t?: Transaction): Promise<number> {
  return HandIn.count({ where: { assignmentId }, distinct: true, col: 'studentId', transaction: t });
}

async function summaryOf(klass: ClassGroup, role: ClassRole, user: PublicUser, t?: Transaction): Promise<ClassSummary> {
  const [studentCount, assignments] = await Promise.all([
    ClassMember.count({ where: { classId: klass.id }, transaction: t }),
    Assignment.findAll({ where: { classId: klass.id }, attributes: ['id', 'dueAt'], transaction: t }),
  ]);
  let nextDueAt: Date | null = null;
  if (role === 'student') {
    // The earliest due date still ahead among the assignments the student has not handed in.
    const handedIn = new Set(
      (await HandIn.findAll({ where: { studentId: user.id }, attributes: ['assignmentId'], transaction: t })).map(
        (h) => h.assignmentId,
      ),
    );
    const now = Date.now();
    for (const a of assignments) {
      if (handedIn.has(a.id) || a.dueAt.getTime() <= now) continue;
      if (!nextDueAt || a.dueAt < nextDueAt) nextDueAt = a.dueAt;
    }
  }
  return {
    id: klass.id,
    name: klass.name,
    term: klass.term,
    role,
    instructor: { id: klass.instructorId, name: klass.instructor?.name ?? '' },
    closed: !!klass.closedAt,
    deletedAt: iso(klass.deletedAt),
    studentCount,
    assignmentCount: assignments.length,
    nextDueAt: iso(nextDueAt),
    createdAt: klass.createdAt.toISOString(),
  };
}

async function assignmentSummaries(
  klass: ClassGroup,
  role: ClassRole,
  user: PublicUser,
  t?: Transaction,
): Promise<AssignmentSummary[]> {
  const rows = await Assignment.findAll({
    where: { classId: klass.id },
    order: [
      ['dueAt', 'ASC'],
      ['id', 'ASC'],
    ],
    transaction: t,
  });
  return Promise.all(
    rows.map(async (a): Promise<AssignmentSummary> => {
      const own = await HandIn.count({ where: { assignmentId: a.id, studentId: user.id }, transaction: t });
      return {
        id: a.id,
        title: a.title,
        dueAt: a.dueAt.toISOString(),
        published: a.published,
        // instructor: how many students handed in; student: how many times they did
        handInCount: role === 'instructor' ? await studentsHandedIn(a.id, t) : own,
        handedIn: own > 0,
      };
    }),
  );
}

/** The class page: the roster, invitations and join code go to whoever teaches it, never to students. */
export async function detailOf(
  klass: ClassGroup,
  role: ClassRole,
  user: PublicUser,
  t?: Transaction,
): Promise<ClassDetail> {
  const summary = await summaryOf(klass, role, user, t);
  const assignments = await assignmentSummaries(klass, role, user, t);
  if (role !== 'instructor') return { ...summary, joinCode: null, members: null, invites: null, assignments };
  const members = await ClassMember.findAll({ where: { classId: klass.id }, transaction: t });
  const users = await User.findAll({ where: { id: members.map((m) => m.userId) }, transaction: t });
  const byId = new Map(users.map((u) => [u.id, u]));
  const invites = await ClassInvite.findAll({
    where: { classId: klass.id, sentAt: { [Op.ne]: null } },
    order: [
      ['sentAt', 'DESC'],
      ['id', 'DESC'],
    ],
    transaction: t,
  });
  return {
    ...summary,
    joinCode: klass.joinCode,
    members: members
      .filter((m) => byId.has(m.userId))
      .map((m) => {
        const u = byId.get(m.userId)!;
        return { id: u.id, name: u.name, email: u.email, joinedAt: m.createdAt.toISOString() };
      })
      .sort((a, b) => a.name.localeCompare(b.name) || a.id - b.id),
    invites: invites.map(inviteRowOf),
    assignments,
  };
}

/** Instructors and admins make classes; the class and its instructor are one insert, so neither exists alone. */
export async function createClass(user: PublicUser, body: CreateClassBody): Promise<ClassDetail> {
  if (user.role !== 'instructor' && user.role !== 'admin') {
    throw forbidden('only instructors and admins can create classes; ask an admin to make your account an instructor');
  }
  const id = await transaction(async (t) => {
    const klass = await ClassGroup.create(
      { name: body.name, term: body.term || null, instructorId: user.id, joinCode: newJoinCode() },
      { transaction: t },
    );
    return klass.id;
  });
  return getClass(user, id);
}

/**
 * The classes the caller teaches or belongs to, newest first. The instructor also sees the classes they
 * deleted within the restore window (with deletedAt), so that delete can be undone from the list.
 */
export async function listClasses(user: PublicUser): Promise<ClassList> {
  const memberOf = (await ClassMember.findAll({ where: { userId: user.id }, attributes: ['classId'] })).map(
    (m) => m.classId,
  );
  const since = new Date(Date.now() - RESTORE_WINDOW_MS);
  const rows = await ClassGroup.findAll({
    where: {
      [Op.or]: [
        { instructorId: user.id, [Op.or]: [{ deletedAt: null }, { deletedAt: { [Op.gt]: since } }] },
        { id: memberOf, deletedAt: null },
      ],
    },
    include: [{ model: User, as: 'instructor', attributes: ['id', 'name'] }],
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
  });
  const items = await Promise.all(
    rows.map((k) => summaryOf(k, k.instructorId === user.id ? 'instructor' : 'student', user)),
  );
  return { items };
}

export async function getClass(user: PublicUser, id: number): Promise<ClassDetail> {
  const { klass, role } = await classFor(user, id, { deleted: 'include' });
  return detailOf(klass, role, user);
}

/** Rename, change the term, close or reopen. Closing keeps everything; the class just takes no new work. */
export async function updateClass(user: PublicUser, id: number, body: UpdateClassBody): Promise<ClassDetail> {
  return transaction(async (t) => {
    const klass = await taughtClass(user, id, { t });
    if (body.name !== undefined) klass.name = body.name;
    if (body.term !== undefined) klass.term = body.term || null;
    if (body.closed !== undefined) klass.closedAt = body.closed ? (klass.closedAt ?? new Date()) : null;
    await klass.save({ transaction: t });
    return detailOf(klass, 'instructor', user, t);
  });
}

/** Soft delete: students lose sight of it at once; the instructor can restore it within the restore window. */
export async function deleteClass(user: PublicUser, id: number): Promise<ClassDetail> {
  return transaction(async (t) => {
    const klass = await taughtClass(user, id, { t });
    await klass.update({ deletedAt: new Date() }, { transaction: t });
    return detailOf(klass, 'instructor', user, t);
  });
}

export async function restoreClass(user: PublicUser, id: number): Promise<ClassDetail> {
  return transaction(async (t) => {
    const klass = await taughtClass(user, id, { t, deleted: 'only' });
    if (Date.now() - klass.deletedAt!.getTime() > RESTORE_WINDOW_MS) throw notFound('no such class');
    await klass.update({ deletedAt: null }, { transaction: t });
    return detailOf(klass, 'instructor', user, t);
  });
}

/** The instructor removes a student: their access to the class ends; their own sketches (copies) stay theirs. */
export async function removeMember(user: PublicUser, id: number, studentId: number): Promise<void> {
  await transaction(async (t) => {
    const klass = await taughtClass(user, id, { t });
    const removed = await ClassMember.destroy({ where: { classId: klass.id, userId: studentId }, transaction: t });
    if (!removed) throw notFound('no such student in this class');
  });
}

/** A student leaves; their copies stay in their library. */
export async function leaveClass(user: PublicUser, id: number): Promise<void> {
  await transaction(async (t) => {
    const { klass, role } = await classFor(user, id, { t });
    if (role === 'instructor') throw conflict('the instructor cannot leave their own class; delete it instead');
    await ClassMember.destroy({ where: { classId: klass.id, userId: user.id }, transaction: t });
  });
}
