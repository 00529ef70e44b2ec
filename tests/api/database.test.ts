import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ForeignKeyConstraintError, QueryTypes, Transaction } from 'sequelize';
import { startTestServer, type TestServer } from './helpers';
import { testDialect } from './test-database';
import { BUSY_TIMEOUT_MS } from '../../server/database/sqlite';
import { dialectOf, ownLiveSketch } from '../../server/database';
import { ClassMember, Sketch, User } from '../../server/models';
import { seedDemoData } from '../../server/seed';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

type PragmaRow = Record<string, unknown>;

async function readPragmas(opts: object = {}) {
  const q = (sql: string) => server.sequelize.query<PragmaRow>(sql, { type: QueryTypes.SELECT, ...opts });
  const [journal] = await q('PRAGMA journal_mode');
  const [fk] = await q('PRAGMA foreign_keys');
  const [busy] = await q('PRAGMA busy_timeout');
  return { journal: journal.journal_mode, foreignKeys: fk.foreign_keys, busy: Object.values(busy)[0] };
}

// SQLite only: pragmas, the per-transaction connections and the spare connection are how server/database/sqlite.ts
// opens SQLite; PostgreSQL has none of them.
describe.skipIf(testDialect !== 'sqlite')('SQLite connection settings', () => {
  it('are in force on the default connection', async () => {
    expect(await readPragmas()).toEqual({ journal: 'wal', foreignKeys: 1, busy: BUSY_TIMEOUT_MS });
  });

  it('are in force on the separate connection a transaction opens', async () => {
    const inside = await server.sequelize.transaction((transaction) => readPragmas({ transaction }));
    expect(inside).toEqual({ journal: 'wal', foreignKeys: 1, busy: BUSY_TIMEOUT_MS });
  });

  it('are in force on a connection opened while the reused transaction connection is busy', async () => {
    const both = await server.sequelize.transaction(async (outer) => {
      // A second, unmanaged transaction meanwhile gets a fresh connection of its own.
      const inner = await server.sequelize.transaction({ type: Transaction.TYPES.DEFERRED });
      try {
        const innerConnection = (inner as unknown as { connection: unknown }).connection;
        const outerConnection = (outer as unknown as { connection: unknown }).connection;
        return { distinct: innerConnection !== outerConnection, pragmas: await readPragmas({ transaction: inner }) };
      } finally {
        await inner.commit();
      }
    });
    expect(both).toEqual({ distinct: true, pragmas: { journal: 'wal', foreignKeys: 1, busy: BUSY_TIMEOUT_MS } });
  });

  it('are in force on the default connection that single writes use', async () => {
    // A query that is not a SELECT stays on the default connection, which writes.
    const raw = async (sql: string) => {
      const answer = (await server.sequelize.query(sql, { type: QueryTypes.RAW })) as unknown[];
      // Sequelize answers [rows, metadata] for a raw query, but the rows alone for PRAGMA foreign_keys.
      const rows = (Array.isArray(answer[0]) ? answer[0] : answer) as PragmaRow[];
      return rows[0];
    };
    expect({
      journal: (await raw('PRAGMA journal_mode')).journal_mode,
      foreignKeys: (await raw('PRAGMA foreign_keys')).foreign_keys,
      busy: Object.values(await raw('PRAGMA busy_timeout'))[0],
      queryOnly: (await raw('PRAGMA query_only')).query_only,
    }).toEqual({ journal: 'wal', foreignKeys: 1, busy: BUSY_TIMEOUT_MS, queryOnly: 0 });
  });

  it('make the connection of reads outside a transaction refuse writes', async () => {
    const [row] = await server.sequelize.query<PragmaRow>('PRAGMA query_only', { type: QueryTypes.SELECT });
    expect(row.query_only).toBe(1);
    await expect(
      server.sequelize.query("UPDATE users SET name = 'never' WHERE id = 1", { type: QueryTypes.SELECT }),
    ).rejects.toThrow(/readonly/);
    const inside = await server.sequelize.transaction((transaction) =>
      server.sequelize.query<PragmaRow>('PRAGMA query_only', { type: QueryTypes.SELECT, transaction }),
    );
    expect(inside[0].query_only).toBe(0);
  });
});

describe('reads and writes', () => {
  it('let a read see a write committed just before it', async () => {
    const user = await User.create({ email: 'reads-see-writes@example.test', name: 'Before', passwordHash: 'x' });
    for (let i = 0; i < 20; i++) {
      await User.update({ name: `Name ${i}` }, { where: { id: user.id } });
      expect((await User.findByPk(user.id))?.name).toBe(`Name ${i}`);
    }
    await server.sequelize.transaction((transaction) => user.update({ name: 'In a transaction' }, { transaction }));
    expect((await User.findByPk(user.id))?.name).toBe('In a transaction');
    // The demo seed's test below counts the accounts.
    await user.destroy();
    expect(await User.findByPk(user.id)).toBeNull();
  });
});

describe('the hot reads', () => {
  const asDate = (value: string | Date) => (value instanceof Date ? value : new Date(value));

  it('bind a date so that it compares with the dates Sequelize stored, and read them back to the millisecond', async () => {
    const user = await User.create({ email: 'select-rows@example.test', name: 'Plain Read', passwordHash: 'x' });
    const stored = user.createdAt.getTime();
    const within = (from: number, to: number) =>
      dialectOf(server.sequelize).selectRows<{ id: number; createdAt: string | Date }>(
        server.sequelize,
        'SELECT id, "createdAt" FROM users WHERE id = :id AND "createdAt" >= :from AND "createdAt" <= :to',
        { id: user.id, from: new Date(from), to: new Date(to) },
      );
    // A bound date one millisecond either side of the stored one must fall on the right side of it: with the date
    // written in another form than Sequelize's, the comparison (text on SQLite) would go wrong.
    const [row] = await within(stored, stored);
    expect(row.id).toBe(user.id);
    expect(asDate(row.createdAt).getTime()).toBe(stored);
    expect(await within(stored + 1, stored + 60_000)).toEqual([]);
    expect(await within(stored - 60_000, stored - 1)).toEqual([]);
    await user.destroy();
  });

  it("read one's own live sketch as the model does, a save at once, and nothing for a deleted or foreign one", async () => {
    const owner = await User.create({ email: 'hot-sketch@example.test', name: 'Hot Owner', passwordHash: 'x' });
    const other = await User.create({ email: 'hot-other@example.test', name: 'Hot Other', passwordHash: 'x' });
    const sketch = await Sketch.create({ ownerId: owner.id, name: 'Hot', layout: 'four-link', document: '{"a":1}' });
    const fields = (s: Sketch) => {
      const { id, ownerId, name, layout, document, version, share, shareToken, deletedAt, createdAt, updatedAt } =
        s.get({ plain: true });
      return { id, ownerId, name, layout, document, version, share, shareToken, deletedAt, createdAt, updatedAt };
    };
    for (let version = 2; version <= 4; version++) {
      await sketch.update({ version, name: `Hot v${version}`, document: `{"v":${version}}` });
      await sketch.reload();
      expect(await ownLiveSketch(server.sequelize, sketch.id, owner.id)).toEqual(fields(sketch));
    }
    expect(await ownLiveSketch(server.sequelize, sketch.id, other.id)).toBeNull();
    await sketch.update({ deletedAt: new Date() });
    expect(await ownLiveSketch(server.sequelize, sketch.id, owner.id)).toBeNull();
    await sketch.destroy();
    await owner.destroy();
    await other.destroy();
  });
});

describe('database constraints', () => {
  it('enforce foreign keys inside a transaction', async () => {
    await expect(
      server.sequelize.transaction((transaction) =>
        ClassMember.create({ classId: 999999, userId: 999999 }, { transaction }),
      ),
    ).rejects.toBeInstanceOf(ForeignKeyConstraintError);
  });
});

describe('demo seed', () => {
  it('creates the demo accounts, the two further students of the class too, with their roles, and running it again adds nothing', async () => {
    await seedDemoData(server.sequelize);
    const users = await User.findAll({ order: [['email', 'ASC']] });
    expect(users.map((u) => [u.email, u.role])).toEqual([
      ['admin@demo.test', 'admin'],
      ['instructor@demo.test', 'instructor'],
      ['jo.marlowe@demo.test', 'member'],
      ['kit.ambery@demo.test', 'member'],
      ['maker@demo.test', 'member'],
      ['student@demo.test', 'member'],
    ]);
  });
});
