/**
 * What a layout brings to the kinematics core, behind one interface: its starter, and the
 * reader that adds the layout's readings to the generic rows and notes to the warnings.
 * A reader finds its structure from the model's points and members, never from `layout`
 * (a sketch edited on the board keeps the readings its parts allow), so rows.ts applies
 * every reader in turn and each one that finds its parts adds its fields.
 */
import type { Layout } from '../../schema/sketch';
import type { SolvedRow } from '../march';
import type { LinkageModel, PointModel } from '../model';
import type { FrontPoint, HeaveRow, RollRow, SidePoint } from '../types';
import type { Vec3 } from '../vec';
import type { StarterSpec } from './starterTypes';
import type { SteerLinkage } from '../steer/linkage';

/** Where a point is in the row being read (mm). */
export type PlacePoint = (p: PointModel) => Vec3;

/**
 * The body-fixed roll centre (rear view) and left side-view instant centre of a roll row, in the
 * frame's axes: rows.ts measures them from the ground under the wheels. A later reader's replace
 * an earlier one's; absent or null: not defined.
 */
export interface RollCentres {
  rollCenter?: FrontPoint | null;
  instantCenter?: SidePoint | null;
}

/** A reader's plan for one model, made once per sweep; each part is optional. */
export interface LayoutRowPlan {
  /** fields added to (or replacing generic ones of) a heave row */
  heave?(at: PlacePoint, solved: SolvedRow): Partial<HeaveRow>;
  /** fields added to a roll row */
  roll?(at: PlacePoint, solved: SolvedRow): Partial<RollRow>;
  /** the roll centre and instant centre of a roll row (for their heights above the ground) */
  rollCentres?(at: PlacePoint, solved: SolvedRow): RollCentres;
  /** plain sentences for the result's warnings, from the heave rows */
  notes?(heave: HeaveRow[]): string[];
}

/** The readings of one family of layouts (the three link layouts share one). */
export interface LayoutReader {
  /** names the family (in tests and the reading order) */
  name: string;
  /** the plan when the model has this family's parts (or has something to note about them); null otherwise */
  plan(model: LinkageModel): LayoutRowPlan | null;
  /**
   * For a layout that steers: its steering (the input and, each side, the wheel's body, steering axis and tie
   * rod) when the model has it, a sentence naming the problem when its parts cannot steer, null when it has no
   * steering parts at all (steer/sweep.ts asks every reader in turn)
   */
  steering?(model: LinkageModel): SteerLinkage | string | null;
}

/** Everything one layout type is: its starter and its readings. */
export interface LayoutModule {
  layout: Layout;
  starter: StarterSpec;
  reader: LayoutReader;
}
