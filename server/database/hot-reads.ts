import type { Sequelize } from 'sequelize';
import type { Role } from '../../shared/schema/accounts';
import type { ShareMode } from '../../shared/schema/sketchRequests';
import { dialectOf } from '.';

/*
 * The reads every signed-in request makes, as plain statements that SQLite and PostgreSQL both read (identifiers with
 * capitals in double quotes), run by the dialect's selectRows (see there why not through Sequelize's models). Each is
 * read afresh on every request: a revoked session, a disabled account or a saved sketch shows at once on every
 * instance.
 */

/** A date column as the driver gives it: SQLite the text Sequelize wrote, PostgreSQL a Date. */
function dateOf(value: string | Date): Date {
  return value instanceof Date ? value : new Date(value);
}

/** The account a session belongs to, as read with it. */
export interface SessionAccountRecord {
  id: number;
  email: string;
  name: string;
  role: Role;
  disabled: boolean;
}

interface SessionAccountRow {
  data: string | null;
  accountId: number | null;
  email: string | null;
  name: string | null;
  role: Role | null;
  /** SQLite gives 0 or 1, PostgreSQL a boolean. */
  disabled: boolean | number | null;
}

/**
 * A live (unexpired at `now`) session's stored data and the account it belongs to (null for a session without one),
 * in one statement; null when there is no such session.
 */
export async function sessionWithAccount(
  sequelize: Sequelize,
  sid: string,
  now: Date,
): Promise<{ data: string; account: SessionAccountRecord | null } | null> {
  const [row] = await dialectOf(sequelize).selectRows<SessionAccountRow>(
    sequelize,
    'SELECT s.data AS data, u.id AS "accountId", u.email AS email, u.name AS name, u.role AS role, ' +
      'u.disabled AS disabled FROM sessions s LEFT JOIN users u ON u.id = s."userId" ' +
      'WHERE s.sid = :sid AND s.expires > :now',
    { sid, now },
  );
  if (!row?.data) return null;
  const account =
    row.accountId === null
      ? null
      : { id: row.accountId, email: row.email!, name: row.name!, role: row.role!, disabled: Boolean(row.disabled) };
  return { data: row.data, account };
}

/** The columns of a live sketch that its detail shows. */
export interface LiveSketchRecord {
  id: number;
  ownerId: number;
  name: string;
  layout: string;
  /** The sketch file as stored (JSON text). */
  document: string;
  version: number;
  share: ShareMode;
  shareToken: string | null;
  deletedAt: null;
  createdAt: Date;
  updatedAt: Date;
}

interface LiveSketchRow extends Omit<LiveSketchRecord, 'createdAt' | 'updatedAt'> {
  createdAt: string | Date;
  updatedAt: string | Date;
}

/** Sketch `id` when `ownerId` owns it and it is not deleted, else null. */
export async function ownLiveSketch(
  sequelize: Sequelize,
  id: number,
  ownerId: number,
): Promise<LiveSketchRecord | null> {
  const [row] = await dialectOf(sequelize).selectRows<LiveSketchRow>(
    sequelize,
    'SELECT id, "ownerId", name, layout, document, version, share, "shareToken", "deletedAt", "createdAt", ' +
      '"updatedAt" FROM sketches WHERE id = :id AND "ownerId" = :ownerId AND "deletedAt" IS NULL',
    { id, ownerId },
  );
  return row ? { ...row, createdAt: dateOf(row.createdAt), updatedAt: dateOf(row.updatedAt) } : null;
}
