/**
 * Readings the sweep gives per member (shocks, springs, links) rather than once per row: each
 * member's length and its change, a shock's or spring's motion ratio and a spring's wheel rate,
 * and each link's axial load. Labels are the reading's words after the member's name
 * ("Shock SHl length"); CSV columns are `members.<id>.<key>` and `linkLoads.<id>`.
 */
import type { QuantityKind } from '../../../units';
import type { MemberReading } from '../../types';

export interface MemberMetricEntry {
  key: keyof MemberReading;
  /** the words after the member's name */
  label: string;
  quantity: QuantityKind;
  read: (m: MemberReading) => number | undefined;
  /** the CSV column for member `id` */
  csv: (id: string) => string;
  /** absent: every member has it; else only members whose ride reading has it */
  given?: (m: MemberReading) => boolean;
  signed: boolean;
  sign: string;
  /** what the number is, in one sentence (types.ts `definition`) */
  definition: string;
}

export const memberEntries: MemberMetricEntry[] = [
  {
    key: 'length',
    label: 'length',
    quantity: 'length',
    read: (m) => m.length,
    csv: (id) => `members.${id}.length`,
    signed: false,
    sign: "between the member's two points, never negative",
    definition: "Centre-to-centre distance between the member's two end points.",
  },
  {
    key: 'lengthChange',
    label: 'length change',
    quantity: 'length',
    read: (m) => m.lengthChange,
    csv: (id) => `members.${id}.lengthChange`,
    signed: true,
    sign: 'length minus ride length: positive when the member extends',
    definition: "Change of the member's length from its length at ride height.",
  },
  {
    key: 'motionRatio',
    label: 'motion ratio',
    quantity: 'ratio',
    read: (m) => m.motionRatio,
    csv: (id) => `members.${id}.motionRatio`,
    given: (m) => m.motionRatio !== undefined,
    signed: false,
    sign: '|d length / d travel|, never negative (heave rows, shocks and springs)',
    definition:
      "How fast the member's length changes with wheel travel in the heave sweep: its length change per unit of wheel-centre travel.",
  },
  {
    key: 'wheelRate',
    label: 'wheel rate',
    quantity: 'rate',
    read: (m) => m.wheelRate,
    csv: (id) => `members.${id}.wheelRate`,
    given: (m) => m.wheelRate !== undefined,
    signed: false,
    sign: 'spring rate × motion ratio², never negative (springs with a rate)',
    definition:
      "The spring's rate as felt at the wheel centre in heave: the spring's own rate times its motion ratio squared.",
  },
];

/** The axial load of a link or lateral rod by statics from the axle torque (heave rows of solid axles on links). */
export const linkLoadEntry = {
  key: 'linkLoads',
  label: 'load',
  quantity: 'force' as const,
  read: (loads: Record<string, number> | undefined, id: string) => loads?.[id],
  csv: (id: string) => `linkLoads.${id}`,
  signed: true,
  sign: 'tension positive',
  definition:
    'Axial force in the link or lateral rod, by statics, from the axle torque pushing the axle at the contact patches; ' +
    'the springs carry the weight.',
};

/** The member reading a view names. */
export function memberEntry(key: MemberMetricEntry['key']): MemberMetricEntry {
  const e = memberEntries.find((m) => m.key === key);
  if (!e) throw new Error(`No member reading named "${key}" in the registry.`);
  return e;
}
