/**
 * The board's edits as pure functions: each takes a sketch and returns a new one that shares
 * every untouched object with it (so history diffs stay small) and never changes its input.
 * A request that cannot be carried out (unknown id, duplicate name) throws BoardEditError
 * with a message for the user; nothing is changed then.
 * Lengths in mm.
 */
import type { AxleEnd, MemberKind, Sketch } from '../../../shared/schema/sketch';
import { DEFAULT_AXLE_END, MAX_ID_LENGTH, drivelinePointKeys } from '../../../shared/schema/sketch';
import type { Mm } from '../../../shared/units';
import { vecDistance, type Vec3 } from '../../../shared/vec3';

export type Point = Sketch['points'][number];
export type Member = Sketch['members'][number];
export type Axis = 'x' | 'y' | 'z';
export type Delta = Partial<Vec3>;

/** A request the board refuses, with the reason in words for the user. */
export class BoardEditError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'BoardEditError';
  }
}

/** Default stroke limits for a member turned into a shock: a fraction of its length either way. */
export const NEW_SHOCK_COMPRESSED_FRACTION = 0.8;
export const NEW_SHOCK_EXTENDED_FRACTION = 1.2;

function pointIndex(doc: Sketch, id: string): number {
  const i = doc.points.findIndex((p) => p.id === id);
  if (i < 0) throw new BoardEditError(`There is no pivot '${id}'.`);
  return i;
}

function memberIndex(doc: Sketch, id: string): number {
  const i = doc.members.findIndex((m) => m.id === id);
  if (i < 0) throw new BoardEditError(`There is no member '${id}'.`);
  return i;
}

function checkNewId(taken: Iterable<string>, id: string, what: 'pivot' | 'member'): void {
  if (id.trim() !== id || id.length === 0)
    throw new BoardEditError(`A ${what} name must not be empty or start or end with a space.`);
  if (id.length > MAX_ID_LENGTH) throw new BoardEditError(`A ${what} name has at most ${MAX_ID_LENGTH} characters.`);
  for (const t of taken) if (t === id) throw new BoardEditError(`There is already a ${what} called '${id}'.`);
}

/** The length of a member between its two pivots at ride, or null when an end is missing. */
export function memberLength(doc: Sketch, m: Member): Mm | null {
  const a = doc.points.find((p) => p.id === m.a);
  const b = doc.points.find((p) => p.id === m.b);
  return a && b ? vecDistance(a, b) : null;
}

/**
 * The other end of each ball joint: the arm's point and the knuckle's are one place (the sweep takes the
 * joint at the arm's point), so moving either moves both.
 */
function ballJointPartners(doc: Sketch): Map<string, string> {
  const partners = new Map<string, string>();
  for (const m of doc.members)
    if (m.kind === 'ball-joint') {
      partners.set(m.a, m.b);
      partners.set(m.b, m.a);
    }
  return partners;
}

/**
 * Moves pivots by the given deltas (mm). With `pairs`, each moved pivot's partner that is not
 * itself being moved follows with the mirror-image delta (y negated). A ball joint's other point
 * follows with the same delta.
 */
export function movePoints(
  doc: Sketch,
  deltas: ReadonlyMap<string, Delta>,
  pairs?: ReadonlyMap<string, string>,
): Sketch {
  const all = new Map(deltas);
  if (pairs) {
    for (const [id, d] of deltas) {
      const partner = pairs.get(id);
      if (partner && !deltas.has(partner))
        all.set(partner, { x: d.x, y: d.y === undefined ? undefined : -d.y, z: d.z });
    }
  }
  const joined = ballJointPartners(doc);
  for (const [id, d] of [...all]) {
    const other = joined.get(id);
    if (other && !all.has(other)) all.set(other, d);
  }
  for (const id of all.keys()) pointIndex(doc, id);
  const points = doc.points.map((p) => {
    const d = all.get(p.id);
    if (!d || (!d.x && !d.y && !d.z)) return p;
    return { ...p, x: p.x + (d.x ?? 0), y: p.y + (d.y ?? 0), z: p.z + (d.z ?? 0) };
  });
  return { ...doc, points };
}

/**
 * Puts pivots where a table says (mm), each exactly: no mirroring, since a table gives every pivot it
 * moves. An unknown id changes nothing and throws.
 */
export function placePoints(doc: Sketch, positions: ReadonlyMap<string, Vec3>): Sketch {
  for (const id of positions.keys()) pointIndex(doc, id);
  const points = doc.points.map((p) => {
    const to = positions.get(p.id);
    return to && (to.x !== p.x || to.y !== p.y || to.z !== p.z) ? { ...p, x: to.x, y: to.y, z: to.z } : p;
  });
  return points.every((p, i) => p === doc.points[i]) ? doc : { ...doc, points };
}

/** Sets one coordinate of a pivot (mm); with `pairs` the partner moves by the mirror-image delta. */
export function setPointCoordinate(
  doc: Sketch,
  id: string,
  axis: Axis,
  value: Mm,
  pairs?: ReadonlyMap<string, string>,
): Sketch {
  const p = doc.points[pointIndex(doc, id)];
  const delta: Delta = { [axis]: value - p[axis] };
  return movePoints(doc, new Map([[id, delta]]), pairs);
}

/** Renames a pivot and every reference to it (member ends, wheels, driveline). */
export function renamePoint(doc: Sketch, from: string, to: string): Sketch {
  const i = pointIndex(doc, from);
  if (from === to) return doc;
  checkNewId(
    doc.points.map((p) => p.id),
    to,
    'pivot',
  );
  const ref = (v: string) => (v === from ? to : v);
  const points = doc.points.slice();
  points[i] = { ...points[i], id: to };
  const members = doc.members.map((m) => (m.a === from || m.b === from ? { ...m, a: ref(m.a), b: ref(m.b) } : m));
  const wheels =
    doc.wheels.left === from || doc.wheels.right === from
      ? { ...doc.wheels, left: ref(doc.wheels.left), right: ref(doc.wheels.right) }
      : doc.wheels;
  let driveline = doc.driveline;
  if (driveline && drivelinePointKeys.some((k) => doc.driveline?.[k] === from)) {
    // Only the four point fields name pivots; the settings beside them (shaft type…) stay as they are.
    const moved = { ...driveline };
    for (const k of drivelinePointKeys) moved[k] = ref(moved[k]);
    driveline = moved;
  }
  return { ...doc, points, members, wheels, ...(driveline ? { driveline } : {}) };
}

/** Renames a member. */
export function renameMember(doc: Sketch, from: string, to: string): Sketch {
  const i = memberIndex(doc, from);
  if (from === to) return doc;
  checkNewId(
    doc.members.map((m) => m.id),
    to,
    'member',
  );
  const members = doc.members.slice();
  members[i] = { ...members[i], id: to };
  return { ...doc, members };
}

/** What refers to a pivot, in words ("member LLl", "the left wheel"). */
export function pointReferences(doc: Sketch, id: string): string[] {
  const refs = doc.members.filter((m) => m.a === id || m.b === id).map((m) => `member ${m.id}`);
  if (doc.wheels.left === id) refs.push('the left wheel centre');
  if (doc.wheels.right === id) refs.push('the right wheel centre');
  for (const k of drivelinePointKeys) if (doc.driveline?.[k] === id) refs.push(`the driveline (${k})`);
  return refs;
}

/** Adds a pivot. */
export function addPoint(doc: Sketch, point: Point): Sketch {
  checkNewId(
    doc.points.map((p) => p.id),
    point.id,
    'pivot',
  );
  return { ...doc, points: [...doc.points, point] };
}

/** Deletes a pivot nothing refers to. */
export function deletePoint(doc: Sketch, id: string): Sketch {
  pointIndex(doc, id);
  const refs = pointReferences(doc, id);
  if (refs.length) throw new BoardEditError(`Pivot '${id}' is still used by ${refs.join(', ')}.`);
  return { ...doc, points: doc.points.filter((p) => p.id !== id) };
}

/** Adds a member, with any new pivots it needs (added first). */
export function addMember(doc: Sketch, member: Member, newPoints: readonly Point[] = []): Sketch {
  let out = doc;
  for (const p of newPoints) out = addPoint(out, p);
  checkNewId(
    out.members.map((m) => m.id),
    member.id,
    'member',
  );
  for (const end of [member.a, member.b]) pointIndex(out, end);
  if (member.a === member.b) throw new BoardEditError('A member joins two different pivots.');
  return { ...out, members: [...out.members, member] };
}

/** Deletes a member; its pivots stay. */
export function deleteMember(doc: Sketch, id: string): Sketch {
  memberIndex(doc, id);
  return { ...doc, members: doc.members.filter((m) => m.id !== id) };
}

/** Fields that belong to one kind only, dropped when the member changes kind. */
const KIND_FIELDS: Record<string, readonly string[]> = {
  link: ['group'],
  shock: ['minLength', 'maxLength'],
  spring: ['rate'],
  hinge: ['body'],
};

/**
 * Turns a member into another kind. Fields of the old kind go; a new shock gets stroke limits
 * around its present length; a hinge needs both ends on the frame and the arm it carries.
 */
export function setMemberKind(doc: Sketch, id: string, kind: MemberKind, hingeBody?: 'arm-left' | 'arm-right'): Sketch {
  const i = memberIndex(doc, id);
  const old = doc.members[i];
  if (old.kind === kind) return doc;
  const kept: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(old)) if (!(KIND_FIELDS[old.kind] ?? []).includes(k)) kept[k] = v;
  kept.kind = kind;
  if (kind === 'shock') {
    const len = memberLength(doc, old) ?? 0;
    kept.minLength = Math.round(len * NEW_SHOCK_COMPRESSED_FRACTION);
    kept.maxLength = Math.round(len * NEW_SHOCK_EXTENDED_FRACTION);
  }
  if (kind === 'hinge') {
    const a = doc.points[pointIndex(doc, old.a)];
    const b = doc.points[pointIndex(doc, old.b)];
    if (a.body !== 'frame' || b.body !== 'frame')
      throw new BoardEditError('A hinge axis runs between two frame pivots.');
    const body = hingeBody ?? (a.y + b.y >= 0 ? 'arm-left' : 'arm-right');
    kept.body = body;
  }
  const members = doc.members.slice();
  members[i] = kept as Member;
  return { ...doc, members };
}

/** Changes the pivots a member joins. */
export function setMemberEnds(doc: Sketch, id: string, a: string, b: string): Sketch {
  const i = memberIndex(doc, id);
  pointIndex(doc, a);
  pointIndex(doc, b);
  if (a === b) throw new BoardEditError('A member joins two different pivots.');
  const m = doc.members[i];
  if (m.a === a && m.b === b) return doc;
  const members = doc.members.slice();
  members[i] = { ...m, a, b };
  return { ...doc, members };
}

/** Member fields a user sets in the member table. `undefined` removes the field. */
export type MemberField = 'minLength' | 'maxLength' | 'rate' | 'group';

export function setMemberField(
  doc: Sketch,
  id: string,
  field: MemberField,
  value: number | string | undefined,
): Sketch {
  const i = memberIndex(doc, id);
  const m = doc.members[i] as Record<string, unknown>;
  if (m[field] === value) return doc;
  const next: Record<string, unknown> = { ...m };
  if (value === undefined) delete next[field];
  else next[field] = value;
  const members = doc.members.slice();
  members[i] = next as Member;
  return { ...doc, members };
}

/** Vehicle dimensions the board edits (mm). */
export type VehicleField = 'wheelbase' | 'cgHeight' | 'track' | 'tireRadius';

export function setVehicleField(doc: Sketch, field: VehicleField, value: Mm): Sketch {
  if (doc.vehicle[field] === value) return doc;
  return { ...doc, vehicle: { ...doc.vehicle, [field]: value } };
}

/**
 * Puts a solid axle at the front or the rear (`vehicle.axle`). Rear is the default: choosing it removes the
 * field, so a file that never had one is left as it was.
 */
export function setAxleEnd(doc: Sketch, end: AxleEnd): Sketch {
  if ((doc.vehicle.axle ?? DEFAULT_AXLE_END) === end) return doc;
  const vehicle = { ...doc.vehicle };
  if (end === DEFAULT_AXLE_END) delete vehicle.axle;
  else vehicle.axle = end;
  return { ...doc, vehicle };
}

/** Top-level fields the board replaces whole. */
type WholeField = 'name' | 'sweep' | 'targets' | 'tracing';

/** Sets (or with `undefined`, removes) a top-level field of the document. */
function setField<K extends WholeField>(doc: Sketch, key: K, value: Sketch[K]): Sketch {
  if (doc[key] === value) return doc;
  const next: Sketch = { ...doc };
  if (value === undefined) delete next[key];
  else next[key] = value;
  return next;
}

/** Renames the sketch. */
export function renameSketch(doc: Sketch, name: string): Sketch {
  return setField(doc, 'name', name);
}

/** Replaces the sweep settings block. */
export function setSweepSettings(doc: Sketch, sweep: Sketch['sweep']): Sketch {
  return setField(doc, 'sweep', sweep);
}

/** Replaces the target bands; `undefined` removes the field. */
export function setTargets(doc: Sketch, targets: Sketch['targets']): Sketch {
  return setField(doc, 'targets', targets);
}

/** Replaces the tracing photos; `undefined` removes the field. */
export function setTracing(doc: Sketch, tracing: Sketch['tracing']): Sketch {
  return setField(doc, 'tracing', tracing);
}

/** The driveline's settings beside its four points (shaft type, joint-angle rules, slip yoke). */
export type DrivelineSettings = Partial<
  Pick<NonNullable<Sketch['driveline']>, 'shaft' | 'minJointAngle' | 'maxJointAngleMismatch' | 'slipYoke'>
>;

/** Sets the given driveline settings; a key given as `undefined` is removed (its default applies). */
export function setDrivelineSettings(doc: Sketch, settings: DrivelineSettings): Sketch {
  if (!doc.driveline) throw new BoardEditError('This sketch has no driveline.');
  const next = { ...doc.driveline };
  for (const [k, v] of Object.entries(settings) as [keyof DrivelineSettings, unknown][]) {
    if (v === undefined) delete next[k];
    else Object.assign(next, { [k]: v });
  }
  return { ...doc, driveline: next };
}

/** A free id from a stem: "LL", "LL2", "LL3", … */
export function freeId(taken: Iterable<string>, stem: string): string {
  const set = new Set(taken);
  if (!set.has(stem)) return stem;
  for (let n = 2; ; n++) if (!set.has(`${stem}${n}`)) return `${stem}${n}`;
}
