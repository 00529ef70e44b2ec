/**
 * The bad inputs every door must refuse alike (the schema's checkSketch, the board's edits, the API's sweep,
 * create and import, the command line), each with the problem naming its field as checkSketch words it.
 */
import { starters } from '../../../shared/kinematics';
import type { SketchInput } from '../../../shared/schema/sketch';
import { exampleSketch } from '../kinematics/helpers';

export interface BadInputCase {
  name: string;
  /** a whole sketch file with the fault in it */
  doc: () => SketchInput;
  /** the problem checkSketch reports for it (path: message) */
  problem: string;
}

const wishbone = () => structuredClone(starters['double-wishbone']!.build()) as SketchInput;
/** Where the first point on `body` sits in the starter's point list. */
const pointOn = (body: string) => wishbone().points.findIndex((p) => p.body === body);
/** Where member `id` sits in the starter's member list. */
const memberAt = (id: string) => wishbone().members.findIndex((m) => m.id === id);

function withoutMember(id: string) {
  const d = wishbone();
  d.members = d.members.filter((m) => m.id !== id);
  return d;
}

export const badInputCases: BadInputCase[] = [
  {
    name: 'an arm body without its hinge (its two frame pivots)',
    doc: () => withoutMember('LWl'),
    problem:
      `points[${pointOn('lower-arm-left')}].body: ` +
      `'lower-arm-left' has no hinge: a wishbone arm turns about two frame pivots`,
  },
  {
    name: "an arm body's hinge with a pivot off the frame",
    doc: () => {
      const d = wishbone();
      d.members = d.members.map((m) => (m.id === 'UWr' ? { ...m, b: 'UW.bj.r' } : m));
      return d;
    },
    problem: `members[${memberAt('UWr')}].b: a hinge axis point must be on the frame ('UW.bj.r' is on 'knuckle-right')`,
  },
  {
    name: 'an arm body without its ball joint',
    doc: () => withoutMember('UBJr'),
    problem:
      `points[${pointOn('upper-arm-right')}].body: ` +
      `'upper-arm-right' has no ball joint: a wishbone arm holds the knuckle at one point`,
  },
  {
    name: 'a member ending on an arm of the other side',
    doc: () => {
      const d = wishbone();
      d.members = d.members.map((m) => (m.id === 'SPl' ? { ...m, a: 'TR.o.r' } : m));
      return d;
    },
    problem:
      `members[${memberAt('SPl')}].b: ` +
      `joins 'knuckle-right' to 'lower-arm-left': a member on a wishbone arm must stay on its side`,
  },
  {
    name: 'slip-yoke limits in the wrong order',
    doc: () => {
      const d = structuredClone(exampleSketch()) as SketchInput;
      d.driveline = { ...d.driveline!, slipYoke: { collapsed: 1500, extended: 1300 } };
      return d;
    },
    problem: 'driveline.slipYoke.extended: must be longer than collapsed (1500 mm)',
  },
  {
    name: 'a negative minimum joint angle',
    doc: () => {
      const d = structuredClone(exampleSketch()) as SketchInput;
      d.driveline = { ...d.driveline!, minJointAngle: -0.5 };
      return d;
    },
    problem: 'driveline.minJointAngle: must be at least 0',
  },
];
