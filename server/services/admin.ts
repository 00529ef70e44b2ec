import { OutboxMessage, User, type Role } from '../models';
import { badRequest, notFound } from '../middleware/http-error';
import { endSessionsOf } from './accounts';
import type { AdminUser, OutboxMessage as OutboxEntry } from '../../shared/schema/apiResponses';

/** Newest messages shown in the mail log. */
const OUTBOX_LIMIT = 200;

function adminView(u: User): AdminUser {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    disabled: u.disabled,
    createdAt: u.createdAt.toISOString(),
  };
}

export async function listUsers(): Promise<{ items: AdminUser[] }> {
  const users = await User.findAll({
    order: [
      ['createdAt', 'ASC'],
      ['id', 'ASC'],
    ],
  });
  return { items: users.map(adminView) };
}

/**
 * Changes a role or disables an account. Disabling ends every session of the account at once.
 * An admin cannot disable or demote themselves, so the site always keeps one admin who can act.
 */
export async function updateUser(
  actorId: number,
  id: number,
  patch: { role?: Role; disabled?: boolean },
): Promise<AdminUser> {
  const user = await User.findByPk(id);
  if (!user) throw notFound('no such user');
  if (id === actorId && (patch.disabled === true || (patch.role && patch.role !== 'admin'))) {
    throw badRequest('you cannot disable your own account or take away your own admin role');
  }
  await user.update(patch);
  if (patch.disabled) await endSessionsOf(user.id);
  return adminView(user);
}

export async function listOutbox(): Promise<{ items: OutboxEntry[] }> {
  const rows = await OutboxMessage.findAll({
    order: [
      ['sentAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: OUTBOX_LIMIT,
  });
  return {
    items: rows.map((m) => ({
      id: m.id,
      to: m.to,
      subject: m.subject,
      text: m.text,
      html: m.html,
      sentAt: m.sentAt.toISOString(),
    })),
  };
}
