import { Op, type Transaction } from 'sequelize';
import type { ServerConfig } from '../../config';
import { ClassGroup, ClassInvite, ClassMember, User, type PublicUser } from '../../models';
import { HttpError, conflict, notFound } from '../../middleware/http-error';
import {
  INVITE_TTL_DAYS,
  type ClassInvite as ClassInviteRow,
  type InviteBody,
  type InvitePreview,
  type InviteResult,
  type JoinResult,
} from '../../../shared/schema/classes';
import type { Mailer } from '../mail/mailer';
import { classInviteMail } from '../mail/messages';
import { assertOpen, isMember, taughtClass } from './access';
import { readInviteList } from './inviteList';
import { inviteRowOf, inviteState, newInviteToken, tokenHash } from './inviteRows';
import { normalJoinCode } from './joinCode';

const DAY_MS = 24 * 3600_000;
const HOUR_MS = 3600_000;
/** Invitation mails handed to the mail server at once (a list of 250 goes out in a few seconds). */
const SEND_CONCURRENCY = 8;

function transaction<T>(work: (t: Transaction) => Promise<T>): Promise<T> {
  return ClassInvite.sequelize!.transaction(work);
}

const expiryFrom = (now: number) => new Date(now + INVITE_TTL_DAYS * DAY_MS);

/** Runs `work` on every item, at most `limit` at a time. */
async function eachLimited<T>(items: readonly T[], limit: number, work: (item: T) => Promise<void>): Promise<void> {
  let next = 0;
  const worker = async () => {
    while (next < items.length) await work(items[next++]);
  };
  await Promise.all(Array.from({ length: Math.min(limit, items.length) }, worker));
}

/** 429 when `count` more mails would take the class over its hourly allowance. Nothing is sent then. */
async function checkHourlyAllowance(klass: ClassGroup, count: number, config: ServerConfig): Promise<void> {
  const max = config.classInviteMaxPerHour;
  const recent = await ClassInvite.count({
    where: { classId: klass.id, sentAt: { [Op.gt]: new Date(Date.now() - HOUR_MS) } },
  });
  if (recent + count > max) {
    throw new HttpError(
      429,
      `a class sends at most ${max} invitation mails an hour; ${recent} went out in the last hour, ` +
        `so at most ${Math.max(0, max - recent)} more can go now; try the rest later`,
    );
  }
}

interface Sender {
  config: ServerConfig;
  mailer: Mailer;
  klass: ClassGroup;
  instructorName: string;
}

/** Mails one invitation with a link carrying `token`; true when the mail server took it. */
function mailInvite(s: Sender, email: string, token: string, expiresAt: Date): Promise<boolean> {
  return s.mailer.send(
    classInviteMail(s.config, {
      to: email,
      instructor: s.instructorName,
      className: s.klass.name,
      token,
      expiresAt,
    }),
  );
}

/**
 * Invites a pasted list. Each address is checked on its own; a malformed one, a student already in the class
 * or the instructor's own address is refused by name; a repeat or an address with a pending invitation is
 * skipped. Each of the rest gets its own mail, and its invitation is kept as sent only once the mail server
 * took that mail: an invitation whose mail failed is removed and listed as refused.
 */
export async function inviteStudents(
  user: PublicUser,
  classId: number,
  body: InviteBody,
  config: ServerConfig,
  mailer: Mailer,
): Promise<InviteResult> {
  const klass = await taughtClass(user, classId);
  assertOpen(klass, 'it sends no invitations');
  const list = readInviteList(body.emails);
  const result: InviteResult = { sent: [], refused: list.refused, skipped: list.skipped };

  const now = Date.now();
  const instructor = await User.findByPk(klass.instructorId, { attributes: ['id', 'name', 'email'] });
  const members = await User.findAll({
    where: { email: list.good },
    attributes: ['id', 'email'],
    include: [{ model: ClassGroup, as: 'classes', where: { id: klass.id }, attributes: ['id'], required: true }],
  });
  const memberEmails = new Set(members.map((m) => m.email));
  const pending = await ClassInvite.findAll({
    where: {
      classId: klass.id,
      email: list.good,
      acceptedAt: null,
      withdrawnAt: null,
      sentAt: { [Op.ne]: null },
      expiresAt: { [Op.gt]: new Date(now) },
    },
    attributes: ['email'],
  });
  const pendingEmails = new Set(pending.map((p) => p.email));
  const toSend: string[] = [];
  for (const email of list.good) {
    if (email === instructor?.email) result.refused.push({ email, problem: 'the instructor of this class' });
    else if (memberEmails.has(email)) result.refused.push({ email, problem: 'already in the class' });
    else if (pendingEmails.has(email)) {
      result.skipped.push({ email, reason: 'already holds a pending invitation; resend it from the roster' });
    } else toSend.push(email);
  }
  if (!toSend.length) return result;
  await checkHourlyAllowance(klass, toSend.length, config);

  const sender: Sender = { config, mailer, klass, instructorName: instructor?.name ?? user.name };
  const expiresAt = expiryFrom(now);
  const tokens = toSend.map(() => newInviteToken());
  // The rows exist (unsent, so they neither show nor work) before the mails, so a sent link always has its row;
  // they are written together, and their outcome too, as one write each rather than two per address.
  const rows = await transaction((t) =>
    ClassInvite.bulkCreate(
      toSend.map((email, i) => ({
        classId: klass.id,
        email,
        tokenHash: tokenHash(tokens[i]),
        invitedById: user.id,
        expiresAt,
      })),
      { transaction: t },
    ),
  );
  const sentAt = new Map<number, Date>();
  await eachLimited(
    rows.map((row, i) => ({ row, token: tokens[i] })),
    SEND_CONCURRENCY,
    async ({ row, token }) => {
      if (await mailInvite(sender, row.email, token, expiresAt)) sentAt.set(row.id, new Date());
    },
  );
  await transaction(async (t) => {
    for (const row of rows) {
      const at = sentAt.get(row.id);
      if (at) await row.update({ sentAt: at }, { transaction: t });
      else await row.destroy({ transaction: t });
    }
  });
  const sent = new Map<string, ClassInviteRow>();
  for (const row of rows) {
    if (sentAt.has(row.id)) sent.set(row.email, inviteRowOf(row));
    else
      result.refused.push({
        email: row.email,
        problem: 'the invitation mail could not be sent; try this address again later',
      });
  }
  result.sent = toSend.filter((e) => sent.has(e)).map((e) => sent.get(e)!);
  return result;
}

async function inviteOf(klass: ClassGroup, inviteId: number): Promise<ClassInvite> {
  const invite = await ClassInvite.findOne({ where: { id: inviteId, classId: klass.id, sentAt: { [Op.ne]: null } } });
  if (!invite) throw notFound('no such invitation');
  return invite;
}

/**
 * Sends the invitation again with a new token and a new expiry: the old link stops working. If the mail
 * fails, nothing changes (the earlier link keeps working until its own expiry) and the answer says so.
 */
export async function resendInvite(
  user: PublicUser,
  classId: number,
  inviteId: number,
  config: ServerConfig,
  mailer: Mailer,
): Promise<ClassInviteRow> {
  const klass = await taughtClass(user, classId);
  assertOpen(klass, 'it sends no invitations');
  const invite = await inviteOf(klass, inviteId);
  const state = inviteState(invite);
  if (state === 'accepted') throw conflict(`${invite.email} has accepted this invitation already`);
  if (state === 'withdrawn')
    throw conflict(`this invitation to ${invite.email} was withdrawn; invite the address anew`);
  await checkHourlyAllowance(klass, 1, config);
  const instructor = await User.findByPk(klass.instructorId, { attributes: ['name'] });
  const token = newInviteToken();
  const expiresAt = expiryFrom(Date.now());
  const sender: Sender = { config, mailer, klass, instructorName: instructor?.name ?? user.name };
  if (!(await mailInvite(sender, invite.email, token, expiresAt))) {
    throw new HttpError(
      503,
      `the invitation mail to ${invite.email} could not be sent; nothing changed, try again later`,
    );
  }
  await invite.update({ tokenHash: tokenHash(token), expiresAt, sentAt: new Date() });
  return inviteRowOf(invite);
}

/** Withdraws a pending invitation: its link stops working. Withdrawing twice is no error. */
export async function withdrawInvite(user: PublicUser, classId: number, inviteId: number): Promise<void> {
  const klass = await taughtClass(user, classId);
  const invite = await inviteOf(klass, inviteId);
  if (invite.acceptedAt) {
    throw conflict(`${invite.email} has accepted this invitation already; remove the student from the roster instead`);
  }
  if (!invite.withdrawnAt) await invite.update({ withdrawnAt: new Date() });
}

const TOKEN_PATTERN = /^[A-Za-z0-9_-]{16,128}$/;
const unknownLink = () => notFound('this invitation link is not valid; check the address or ask for a new invitation');

/** The invitation a link's token names (sent, of a class not deleted), or 404. */
async function invitationByToken(token: string, t?: Transaction): Promise<{ invite: ClassInvite; klass: ClassGroup }> {
  if (!TOKEN_PATTERN.test(token)) throw unknownLink();
  const invite = await ClassInvite.findOne({
    where: { tokenHash: tokenHash(token), sentAt: { [Op.ne]: null } },
    transaction: t,
  });
  if (!invite) throw unknownLink();
  const klass = await ClassGroup.findOne({
    where: { id: invite.classId, deletedAt: null },
    include: [{ model: User, as: 'instructor', attributes: ['id', 'name'] }],
    transaction: t,
  });
  if (!klass) throw notFound('the class of this invitation no longer exists');
  return { invite, klass };
}

/** What a link is for, shown before sign-in too: the class, who invites, to which address, and its state. */
export async function previewInvite(token: string): Promise<InvitePreview> {
  const { invite, klass } = await invitationByToken(token);
  return {
    className: klass.name,
    instructorName: klass.instructor?.name ?? '',
    email: invite.email,
    state: inviteState(invite),
    expiresAt: invite.expiresAt.toISOString(),
  };
}

/** Adds `user` to the class as a student and marks their pending invitations to it (by address) as used. */
async function join(user: PublicUser, klass: ClassGroup, t: Transaction, used?: ClassInvite): Promise<JoinResult> {
  if (klass.instructorId === user.id)
    throw conflict(`you teach the class "${klass.name}"; you cannot join it as a student`);
  if (!(await isMember(klass.id, user.id, t))) {
    assertOpen(klass, 'it takes no new students');
    await ClassMember.create({ classId: klass.id, userId: user.id }, { transaction: t });
  }
  const now = new Date();
  if (used) await used.update({ acceptedAt: now, acceptedById: user.id }, { transaction: t });
  await ClassInvite.update(
    { acceptedAt: now, acceptedById: user.id },
    {
      where: { classId: klass.id, email: user.email, acceptedAt: null, withdrawnAt: null, sentAt: { [Op.ne]: null } },
      transaction: t,
    },
  );
  return { classId: klass.id, className: klass.name };
}

/**
 * Joins the signed-in user to the invitation's class, once: 410 for an expired or withdrawn invitation,
 * 409 for one already used or a closed class. The check and the use are one transaction, so of two
 * uses of one link only the first joins.
 */
export async function acceptInvite(user: PublicUser, token: string): Promise<JoinResult> {
  return transaction(async (t) => {
    const { invite, klass } = await invitationByToken(token, t);
    const state = inviteState(invite);
    if (state === 'accepted') {
      throw conflict('this invitation has been used already; each invitation link joins one person once');
    }
    if (state === 'withdrawn') throw new HttpError(410, 'this invitation was withdrawn by the instructor');
    if (state === 'expired') {
      throw new HttpError(
        410,
        `this invitation expired on ${invite.expiresAt.toISOString().slice(0, 10)}; ask the instructor to send it again`,
      );
    }
    return join(user, klass, t, invite);
  });
}

/** Joins the class whose join code this is; joining a class one is in already is no error. */
export async function joinByCode(user: PublicUser, typed: string): Promise<JoinResult> {
  const code = normalJoinCode(typed);
  return transaction(async (t) => {
    const klass = code
      ? await ClassGroup.findOne({ where: { joinCode: code, deletedAt: null }, transaction: t })
      : null;
    if (!klass) throw notFound('no class has this join code; check it with your instructor');
    return join(user, klass, t);
  });
}
