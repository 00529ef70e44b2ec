import type { Transaction } from 'sequelize';
import { ClassGroup, ClassMember, User, type PublicUser } from '../../models';
import { conflict, forbidden, notFound } from '../../middleware/http-error';

/** How the caller stands to a class: teaching it (its instructor, or an admin) or a student in it. */
export type ClassRole = 'instructor' | 'student';

export interface ClassAccess {
  klass: ClassGroup;
  role: ClassRole;
}

export const noSuchClass = () => notFound('no such class');

const withInstructor = { model: User, as: 'instructor', attributes: ['id', 'name'] };

/** Whether `user` is a student of the class (a row in class_members). */
export async function isMember(classId: number, userId: number, t?: Transaction): Promise<boolean> {
  return (await ClassMember.count({ where: { classId, userId }, transaction: t })) > 0;
}

/**
 * The class and the caller's role in it, or 404 for anyone who is neither its instructor, an admin nor one
 * of its students: a class one may not see looks exactly like a missing one (as sketches do). A deleted
 * class is seen by its instructor (to restore it) only when `deleted` allows it ('only' is taughtClass's).
 */
export async function classFor(
  user: PublicUser,
  classId: number,
  opts: { t?: Transaction; deleted?: 'exclude' | 'include' | 'only' } = {},
): Promise<ClassAccess> {
  const klass = await ClassGroup.findByPk(classId, { include: [withInstructor], transaction: opts.t });
  if (!klass) throw noSuchClass();
  const teaches = klass.instructorId === user.id || user.role === 'admin';
  const role: ClassRole | null = teaches
    ? 'instructor'
    : (await isMember(klass.id, user.id, opts.t))
      ? 'student'
      : null;
  if (!role) throw noSuchClass();
  const deleted = opts.deleted ?? 'exclude';
  if (klass.deletedAt && (role !== 'instructor' || deleted === 'exclude')) throw noSuchClass();
  return { klass, role };
}

/** As classFor, and 403 unless the caller teaches the class (students know it exists, so no 404 for them). */
export async function taughtClass(
  user: PublicUser,
  classId: number,
  opts: { t?: Transaction; deleted?: 'exclude' | 'include' | 'only' } = {},
): Promise<ClassGroup> {
  const { klass, role } = await classFor(user, classId, opts);
  if (role !== 'instructor') throw forbidden('only the instructor of this class may do that');
  if (!klass.deletedAt && opts.deleted === 'only') throw conflict('this class is not deleted');
  return klass;
}

/** 409 while the class is closed: it is read-only, so `what` is refused. */
export function assertOpen(klass: ClassGroup, what: string): void {
  if (klass.closedAt) throw conflict(`the class "${klass.name}" is closed: ${what}`);
}
