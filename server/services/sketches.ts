import { randomBytes } from 'node:crypto';
import { Op, fn, col, type Transaction, type WhereOptions } from 'sequelize';
import { caseInsensitiveContains, ownLiveSketch, type LiveSketchRecord } from '../database';
import { checkSketch, type Sketch as SketchDocument } from '../../shared/schema/sketch';
import { downloadBaseName } from '../../shared/downloadName';
import { ShareRecipient, Shop, Sketch, SketchRevision, User, type PublicUser } from '../models';
import type { SheetSource } from './buildSheetPdf/document';
import { badRequest, conflict, notFound } from '../middleware/http-error';
import type { ListQuery, ShareBody } from '../../shared/schema/sketchRequests';
import type {
  Page,
  RevisionDetail,
  RevisionList,
  ShareState,
  SketchDetail,
  SketchSummary,
} from '../../shared/schema/apiResponses';
import type { ServerConfig } from '../config';
import { sharedSketchUrl } from './links';
import { removeReplacedUploads } from './tracing-uploads';

/** A soft-deleted sketch can be restored for this long (ms); then it is purged. */
export const RESTORE_WINDOW_MS = 30 * 24 * 3600_000;
const SHARE_TOKEN_BYTES = 24;

const withOwner = { model: User, as: 'owner', attributes: ['id', 'name'] };

/** What a sketch's summary and detail show: a Sketch, or the row readOwnSketch reads (a live one, or any). */
type SketchFields = Omit<LiveSketchRecord, 'deletedAt'> & { deletedAt: Date | null; owner?: { name: string } };

function summaryOf(row: SketchFields, viewer: PublicUser | null): SketchSummary {
  return {
    id: row.id,
    name: row.name,
    layout: row.layout,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
    createdAt: row.createdAt.toISOString(),
    // The caller's own sketches are read without the owner (ownSketch): the viewer is the owner.
    owner: { id: row.ownerId, name: row.owner?.name ?? (viewer?.id === row.ownerId ? viewer.name : '') },
    mine: viewer?.id === row.ownerId,
    share: row.share,
    deletedAt: row.deletedAt ? row.deletedAt.toISOString() : null,
  };
}

/** A sketch's detail without its document. */
function detailFieldsOf(row: SketchFields, viewer: PublicUser | null): Omit<SketchDetail, 'document'> {
  const summary = summaryOf(row, viewer);
  return { ...summary, canEdit: summary.mine && !row.deletedAt, shareToken: summary.mine ? row.shareToken : null };
}

function detailOf(row: Sketch, viewer: PublicUser | null): SketchDetail {
  return { ...detailFieldsOf(row, viewer), document: JSON.parse(row.document) as SketchDocument };
}

/**
 * The JSON text of `detailOf(row, viewer)`, with the stored document copied in as it is. Parsing the document only
 * to write it out again was the largest single cost of reading a sketch. The stored text is always the server's
 * own JSON.stringify of a checked document (every write goes through validDocument or copies a stored revision).
 */
function detailJsonOf(row: SketchFields, viewer: PublicUser | null): string {
  const fields = JSON.stringify(detailFieldsOf(row, viewer));
  return `${fields.slice(0, -1)},"document":${row.document}}`;
}

/**
 * Validates a sketch file, applying `name` over the file's own name first (the stored name is
 * always the document's). 400 with one line per problem; `prefix` names where the file sat in the body.
 */
export function validDocument(doc: unknown, name: string | undefined, prefix = ''): SketchDocument {
  const withName = name !== undefined && doc && typeof doc === 'object' && !Array.isArray(doc) ? { ...doc, name } : doc;
  const checked = checkSketch(withName);
  if (!checked.ok) {
    const problems = prefix
      ? checked.problems.map((p) =>
          p.startsWith('(document)') ? prefix + p.slice('(document)'.length) : `${prefix}.${p}`,
        )
      : checked.problems;
    throw badRequest('not a valid sketch', problems);
  }
  return checked.sketch;
}

function transaction<T>(work: (t: Transaction) => Promise<T>): Promise<T> {
  return Sketch.sequelize!.transaction(work);
}

/** The caller's own live sketch, inside `t`, or 404 (someone else's sketch looks exactly like a missing one). */
async function ownSketch(
  user: PublicUser,
  id: number,
  t?: Transaction,
  opts: { deleted?: boolean } = {},
): Promise<Sketch> {
  // No join to the owner: it is `user`, and the include roughly doubled the CPU of this query (summaryOf names the
  // owner from the viewer). Every signed-in read and save of a sketch comes through here.
  const row = await Sketch.findOne({
    where: { id, ownerId: user.id, deletedAt: opts.deleted ? { [Op.ne]: null } : null },
    transaction: t,
    // On a server database the row stays locked to the end of `t`, so two saves of one version cannot both
    // pass the version check; SQLite's IMMEDIATE transactions already run one writer at a time.
    lock: t ? { level: t.LOCK.UPDATE, of: Sketch } : undefined,
  });
  if (!row) throw notFound('no such sketch');
  return row;
}

/** Records the sketch's current state as revision number `version` (every version change makes exactly one). */
async function addRevision(row: Sketch, authorId: number, t: Transaction): Promise<void> {
  await SketchRevision.create(
    { sketchId: row.id, rev: row.version, version: row.version, name: row.name, document: row.document, authorId },
    { transaction: t },
  );
}

async function insertSketch(owner: PublicUser, doc: SketchDocument): Promise<SketchDetail> {
  const id = await transaction(async (t) => {
    const row = await Sketch.create(
      { ownerId: owner.id, name: doc.name, layout: doc.layout, document: JSON.stringify(doc) },
      { transaction: t },
    );
    await addRevision(row, owner.id, t);
    return row.id;
  });
  return getSketch(owner, id);
}

/** Runs `change` on the caller's own sketch inside one transaction and answers its new state. */
async function changeOwn(
  user: PublicUser,
  id: number,
  change: (row: Sketch, t: Transaction) => Promise<void>,
  opts: { deleted?: boolean } = {},
): Promise<SketchDetail> {
  return transaction(async (t) => {
    const row = await ownSketch(user, id, t, opts);
    await change(row, t);
    return detailOf(row, user);
  });
}

/** The caller's sketches (and, with classes, those shared with them), filtered, sorted and paged. */
export async function listSketches(user: PublicUser, query: ListQuery): Promise<Page<SketchSummary>> {
  const conditions: WhereOptions[] = [{ ownerId: user.id }];
  if (query.deleted) conditions.push({ deletedAt: { [Op.gt]: new Date(Date.now() - RESTORE_WINDOW_MS) } });
  else conditions.push({ deletedAt: null });
  if (query.layout) conditions.push({ layout: query.layout });
  if (query.q) conditions.push(caseInsensitiveContains(Sketch.sequelize!, 'Sketch.name', query.q));
  const sortColumn = query.sort === 'name' ? fn('lower', col('Sketch.name')) : col(`Sketch.${query.sort}`);
  const direction = query.order.toUpperCase();
  const { rows, count } = await Sketch.findAndCountAll({
    where: { [Op.and]: conditions },
    include: [withOwner],
    order: [
      [sortColumn, direction],
      ['id', direction],
    ],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: rows.map((r) => summaryOf(r, user)), total: count, page: query.page, pageSize: query.pageSize };
}

export async function getSketch(user: PublicUser, id: number): Promise<SketchDetail> {
  return detailOf(await ownSketch(user, id), user);
}

/**
 * The caller's own live sketch, as ownSketch reads it, in one plain statement (ownLiveSketch): every signed-in open
 * of a sketch comes here, and building a model instance cost more CPU than the whole health route.
 */
async function readOwnSketch(user: PublicUser, id: number): Promise<SketchFields> {
  const row = await ownLiveSketch(Sketch.sequelize!, id, user.id);
  if (!row) throw notFound('no such sketch');
  return row;
}

/** getSketch as the JSON text of its answer (GET /api/sketches/:id). */
export async function getSketchJson(user: PublicUser, id: number): Promise<string> {
  return detailJsonOf(await readOwnSketch(user, id), user);
}

export function createSketch(user: PublicUser, doc: SketchDocument): Promise<SketchDetail> {
  return insertSketch(user, doc);
}

/**
 * Saves a new version if `version` is still the current one. The check and the write happen
 * in one IMMEDIATE transaction, so two saves of the same version cannot both succeed.
 */
export function updateSketch(
  user: PublicUser,
  id: number,
  doc: SketchDocument,
  version: number,
): Promise<SketchDetail> {
  return changeOwn(user, id, async (row, t) => {
    if (row.version !== version) {
      throw conflict(`the sketch was saved elsewhere since version ${version}`, { version: row.version });
    }
    const before = row.document;
    row.set({ name: doc.name, layout: doc.layout, document: JSON.stringify(doc), version: row.version + 1 });
    await row.save({ transaction: t });
    await addRevision(row, user.id, t);
    await removeReplacedUploads(row.id, before, row.document, t);
  });
}

export async function deleteSketch(user: PublicUser, id: number): Promise<void> {
  await transaction(async (t) => {
    const row = await ownSketch(user, id, t);
    await row.update({ deletedAt: new Date() }, { transaction: t });
  });
}

export function undeleteSketch(user: PublicUser, id: number): Promise<SketchDetail> {
  return changeOwn(
    user,
    id,
    async (row, t) => {
      if (Date.now() - row.deletedAt!.getTime() > RESTORE_WINDOW_MS) throw notFound('no such sketch');
      await row.update({ deletedAt: null }, { transaction: t });
    },
    { deleted: true },
  );
}

export async function listRevisions(user: PublicUser, id: number): Promise<RevisionList> {
  await ownSketch(user, id);
  const rows = await SketchRevision.findAll({
    where: { sketchId: id },
    attributes: ['rev', 'version', 'name', 'createdAt'],
    order: [['rev', 'DESC']],
  });
  return {
    items: rows.map((r) => ({ rev: r.rev, version: r.version, name: r.name, createdAt: r.createdAt.toISOString() })),
  };
}

async function revisionOf(sketchId: number, rev: number, t?: Transaction): Promise<SketchRevision> {
  const row = await SketchRevision.findOne({ where: { sketchId, rev }, transaction: t });
  if (!row) throw notFound('no such revision');
  return row;
}

export async function getRevision(user: PublicUser, id: number, rev: number): Promise<RevisionDetail> {
  await ownSketch(user, id);
  const r = await revisionOf(id, rev);
  return {
    rev: r.rev,
    version: r.version,
    name: r.name,
    createdAt: r.createdAt.toISOString(),
    document: JSON.parse(r.document) as unknown,
  };
}

/** Makes a new version whose document is that of revision `rev`; the history keeps everything in between. */
export function restoreRevision(user: PublicUser, id: number, rev: number): Promise<SketchDetail> {
  return changeOwn(user, id, async (row, t) => {
    const r = await revisionOf(id, rev, t);
    const doc = JSON.parse(r.document) as SketchDocument;
    const before = row.document;
    row.set({ name: r.name, layout: doc.layout, document: r.document, version: row.version + 1 });
    await row.save({ transaction: t });
    await addRevision(row, user.id, t);
    await removeReplacedUploads(row.id, before, row.document, t);
  });
}

function copyName(name: string): string {
  const suffix = ' (copy)';
  return name.slice(0, 200 - suffix.length) + suffix;
}

async function copyOf(user: PublicUser, source: Sketch): Promise<SketchDetail> {
  const doc = JSON.parse(source.document) as SketchDocument;
  return insertSketch(user, { ...doc, name: copyName(source.name) });
}

export async function copySketch(user: PublicUser, id: number): Promise<SketchDetail> {
  return copyOf(user, await ownSketch(user, id));
}

/** The sketch file and a file name for it. */
export async function exportSketch(user: PublicUser, id: number) {
  const row = await ownSketch(user, id);
  return { fileName: `${downloadBaseName(row.name)}.arcwright.json`, document: JSON.parse(row.document) as unknown };
}

/** A stored sketch's name and document, for the downloads made from it. */
export interface StoredDocument {
  name: string;
  document: unknown;
}

/** One of the caller's sketches, for a download. */
export async function ownDocument(user: PublicUser, id: number): Promise<StoredDocument> {
  const row = await ownSketch(user, id);
  return { name: row.name, document: JSON.parse(row.document) as unknown };
}

/** Most mailings of one link listed in the share dialog, newest first. */
const RECIPIENTS_LISTED = 100;

async function shareStateOf(row: Sketch, config: ServerConfig, t?: Transaction): Promise<ShareState> {
  const recipients = await ShareRecipient.findAll({
    where: { sketchId: row.id },
    order: [
      ['sentAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: RECIPIENTS_LISTED,
    transaction: t,
  });
  return {
    share: row.share,
    shareToken: row.shareToken,
    url: row.share === 'link' && row.shareToken ? sharedSketchUrl(config, row.shareToken) : null,
    recipients: recipients.map((r) => ({ email: r.email, sentAt: r.sentAt.toISOString(), live: !r.linkRevokedAt })),
  };
}

/** Whether the caller's sketch has a live read-only link, the link, and who it was mailed to. */
export async function getShareState(user: PublicUser, id: number, config: ServerConfig): Promise<ShareState> {
  return shareStateOf(await ownSketch(user, id), config);
}

/**
 * Sets who may open the sketch, and with `email` records that the link is mailed there, in one transaction
 * (the caller queues the mail once it has committed). Turning the link on makes a new random token (the old
 * link stays dead); sharing again while it is on keeps the link others already have. Revoking marks every
 * earlier mailing's link as no longer working.
 */
export async function setShare(
  user: PublicUser,
  id: number,
  change: ShareBody,
  config: ServerConfig,
): Promise<ShareState & { name: string }> {
  return transaction(async (t) => {
    const row = await ownSketch(user, id, t);
    if (change.mode === 'private') {
      await row.update({ share: 'private', shareToken: null }, { transaction: t });
      await ShareRecipient.update(
        { linkRevokedAt: new Date() },
        { where: { sketchId: row.id, linkRevokedAt: null }, transaction: t },
      );
    } else if (row.share !== 'link' || !row.shareToken) {
      await row.update(
        { share: 'link', shareToken: randomBytes(SHARE_TOKEN_BYTES).toString('base64url') },
        { transaction: t },
      );
    }
    if (change.email) {
      await ShareRecipient.create({ sketchId: row.id, senderId: user.id, email: change.email }, { transaction: t });
    }
    return { ...(await shareStateOf(row, config, t)), name: row.name };
  });
}

async function sharedSketch(token: string): Promise<Sketch> {
  const row = await Sketch.findOne({
    where: { shareToken: token, share: 'link', deletedAt: null },
    include: [withOwner],
  });
  if (!row) throw notFound('this link is not shared (any more)');
  return row;
}

/** What the build sheet names of a sketch besides its document: its owner and the owner's shop. */
async function sheetSourceOf(row: Sketch): Promise<SheetSource> {
  const owner = await User.findByPk(row.ownerId, { attributes: ['name', 'shopId'] });
  const shop = owner?.shopId ? await Shop.findByPk(owner.shopId, { attributes: ['name'] }) : null;
  return {
    name: row.name,
    owner: owner?.name ?? '',
    shop: shop?.name ?? null,
    version: row.version,
    savedAt: row.updatedAt,
    document: JSON.parse(row.document) as SketchDocument,
  };
}

/** The caller's own sketch for its build sheet. */
export async function sheetSource(user: PublicUser, id: number): Promise<SheetSource> {
  return sheetSourceOf(await ownSketch(user, id));
}

/** A sketch opened by its share link, for its build sheet. */
export async function sharedSheetSource(token: string): Promise<SheetSource> {
  return sheetSourceOf(await sharedSketch(token));
}

/** A sketch opened by its share link, read-only for everyone (the owner edits through /api/sketches). */
export async function getShared(viewer: PublicUser | null, token: string): Promise<SketchDetail> {
  const detail = detailOf(await sharedSketch(token), viewer);
  return { ...detail, canEdit: false, shareToken: null };
}

/** A sketch opened by its share link, for a download. */
export async function sharedDocument(token: string): Promise<StoredDocument> {
  const row = await sharedSketch(token);
  return { name: row.name, document: JSON.parse(row.document) as unknown };
}

export async function copyShared(user: PublicUser, token: string): Promise<SketchDetail> {
  return copyOf(user, await sharedSketch(token));
}

/** The sketch an upload belongs to, if `viewer` (or the holder of `shareToken`) may see it. */
export async function maySeeSketch(viewer: PublicUser | null, sketchId: number, shareToken?: string): Promise<boolean> {
  const row = await Sketch.findOne({
    where: { id: sketchId, deletedAt: null },
    attributes: ['ownerId', 'share', 'shareToken'],
  });
  if (!row) return false;
  if (viewer && row.ownerId === viewer.id) return true;
  return row.share === 'link' && !!shareToken && row.shareToken === shareToken;
}
