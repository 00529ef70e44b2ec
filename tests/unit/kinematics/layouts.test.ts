/**
 * Every layout type of the sketch format has its module (starter and readings) in the
 * kinematics core and its descriptor on the client, and the solver refuses a constraint or a
 * body role it has no function for. Source for the list of layouts: the sketch format's layout
 * list (shared/schema/sketchVocabulary.ts, `layouts`).
 */
import { describe, expect, it } from 'vitest';
import { driveApply } from '../../../shared/kinematics/drive';
import { layoutModules } from '../../../shared/kinematics/layouts';
import { layoutReaders } from '../../../shared/kinematics/layouts/readers';
import {
  constraintRows,
  linkageModelBuild,
  type Constraint,
  type LinkageModel,
} from '../../../shared/kinematics/model';
import { residualsEvaluate, residualWorkCreate } from '../../../shared/kinematics/residuals';
import { starters } from '../../../shared/kinematics/starters';
import { layouts } from '../../../shared/schema/sketchVocabulary';
import { layoutLabel, layoutOptions, suspensionOf, suspensions } from '../../../shared/suspensions';

/** The model of a starter's sketch with one constraint of a kind the solver does not have. */
function modelWithUnknownConstraint(): LinkageModel {
  const model = linkageModelBuild(starters['three-link-lateral-rod'].build());
  const stranger = { type: 'gear', member: model.constraints[0].member } as unknown as Constraint;
  return { ...model, constraints: [...model.constraints, stranger] };
}

describe('layout modules', () => {
  it.each(layouts)('%s has a module whose starter builds a sketch of that layout', (layout) => {
    const module = layoutModules[layout];
    expect(module).toBeDefined();
    expect(module.layout).toBe(layout);
    expect(module.starter.layout).toBe(layout);
    // The starter list the dialog reads holds the same starter, not a copy.
    expect(starters[layout]).toBe(module.starter);
    expect(module.starter.build().layout).toBe(layout);
  });

  it('has no module for a layout the format does not list', () => {
    expect(Object.keys(layoutModules).sort()).toEqual([...layouts].sort());
    expect(Object.keys(starters).sort()).toEqual([...layouts].sort());
  });

  it.each(layouts)("%s's reader is applied to the rows and finds its parts in the starter", (layout) => {
    const { reader, starter } = layoutModules[layout];
    expect(layoutReaders).toContain(reader);
    const plan = reader.plan(linkageModelBuild(starter.build()));
    expect(plan).not.toBeNull();
    expect(typeof plan!.heave).toBe('function');
  });

  it('applies each reader once', () => {
    expect(new Set(layoutReaders).size).toBe(layoutReaders.length);
    expect(new Set(layoutReaders.map((r) => r.name)).size).toBe(layoutReaders.length);
  });
});

describe('client layout descriptors', () => {
  it.each(layouts)('%s has a descriptor named as its starter', (layout) => {
    const d = suspensions[layout];
    expect(d).toBeDefined();
    expect(d.layout).toBe(layout);
    expect(d.label).toBe(starters[layout].label);
    expect(d.label.length).toBeGreaterThan(0);
    expect(layoutLabel(layout)).toBe(d.label);
    expect(suspensionOf(layout)).toBe(d);
  });

  it('offers every layout once in the select, in the format order', () => {
    expect(layoutOptions.map((o) => o.value)).toEqual([...layouts]);
    expect(new Set(layoutOptions.map((o) => o.label)).size).toBe(layouts.length);
  });

  it('shows a name that is not a layout as it is, and has no descriptor for it', () => {
    expect(layoutLabel('cantilever-monoshock')).toBe('cantilever-monoshock');
    expect(suspensionOf('cantilever-monoshock')).toBeNull();
    expect(suspensionOf('toString')).toBeNull();
    expect(suspensionOf(undefined)).toBeNull();
  });
});

describe('constraint dispatch', () => {
  it('refuses a constraint of an unknown kind with an error naming it', () => {
    const model = modelWithUnknownConstraint();
    const r = new Float64Array(model.residualCount + 1);
    const J = new Float64Array((model.residualCount + 1) * model.stateSize);
    const state = new Float64Array(model.stateSize);
    const work = residualWorkCreate(model);
    expect(() => residualsEvaluate(model, state, work, r, J)).toThrow(
      "The solver has no residual for a constraint of kind 'gear'.",
    );
    expect(() => residualsEvaluate(model, state, work, r, null)).toThrow(/kind 'gear'/);
    expect(() => constraintRows(model.constraints.at(-1)!)).toThrow(/kind 'gear'/);
  });

  it('still evaluates every known kind of the starters (one residual per row, zero at ride)', () => {
    for (const layout of layouts) {
      const model = linkageModelBuild(starters[layout].build());
      const r = new Float64Array(model.residualCount).fill(Number.NaN);
      residualsEvaluate(model, new Float64Array(model.stateSize), residualWorkCreate(model), r, null);
      // Ride is where every length is measured, so every row is zero there (sketch-format.md: lengths at ride).
      for (const v of r) expect(Math.abs(v)).toBeLessThan(1e-9);
    }
  });

  it('refuses a body role it has no drive for', () => {
    const model = linkageModelBuild(starters['trailing-arm'].build());
    const odd = { ...model, bodies: [{ ...model.bodies[0], role: 'floating' as never }, ...model.bodies.slice(1)] };
    expect(() => driveApply(odd, new Float64Array(model.stateSize), 10, 0)).toThrow(
      "The sweep has no drive for a body of role 'floating'.",
    );
  });
});
