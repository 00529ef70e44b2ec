/* eslint-disable @typescript-eslint/no-explicit-any -- these tests poke at untyped JSON documents on purpose */
import { describe, expect, it } from 'vitest';
import { checkSketch, parseSketch, type SketchInput } from '../../../shared/schema/sketch';
import { exampleSketch } from '../kinematics/helpers';

function problemsOf(doc: unknown): string[] {
  const r = checkSketch(doc);
  if (r.ok) throw new Error('expected the document to be refused');
  return r.problems;
}

function withDriveline(f: (d: any) => void): SketchInput {
  const doc = exampleSketch() as any;
  f(doc.driveline);
  return doc as SketchInput;
}

describe('driveline settings in the sketch file', () => {
  it('leaves a version-1 driveline without settings as it is (no defaults written in)', () => {
    const s = parseSketch(exampleSketch());
    expect(s.driveline).toEqual({ output: 'DS.o', outputAxis: 'DS.oa', pinion: 'DS.p', pinionAxis: 'DS.pa' });
  });

  it('accepts every setting, and keeps a field it does not know inside the slip yoke', () => {
    const s = parseSketch(
      withDriveline((d) => {
        d.shaft = 'double-cardan';
        d.minJointAngle = 0;
        d.maxJointAngleMismatch = 2.5;
        d.slipYoke = { collapsed: 1350, extended: 1450, note: 'from the yoke drawing' };
      }),
    );
    expect(s.driveline).toMatchObject({
      shaft: 'double-cardan',
      minJointAngle: 0,
      maxJointAngleMismatch: 2.5,
      slipYoke: { collapsed: 1350, extended: 1450, note: 'from the yoke drawing' },
    });
  });

  it('refuses slip-yoke lengths in the wrong order, naming the field', () => {
    expect(problemsOf(withDriveline((d) => (d.slipYoke = { collapsed: 1450, extended: 1350 })))).toContain(
      'driveline.slipYoke.extended: must be longer than collapsed (1450 mm)',
    );
    expect(problemsOf(withDriveline((d) => (d.slipYoke = { collapsed: 1400, extended: 1400 })))).toContain(
      'driveline.slipYoke.extended: must be longer than collapsed (1400 mm)',
    );
  });

  it('refuses a missing, negative or non-number slip-yoke length', () => {
    expect(problemsOf(withDriveline((d) => (d.slipYoke = { collapsed: 1350 })))).toContain(
      'driveline.slipYoke.extended: required, expected a number',
    );
    expect(problemsOf(withDriveline((d) => (d.slipYoke = { collapsed: -5, extended: 1400 })))).toContain(
      'driveline.slipYoke.collapsed: must be greater than 0',
    );
    expect(problemsOf(withDriveline((d) => (d.slipYoke = { collapsed: '1350', extended: 1400 })))).toContain(
      'driveline.slipYoke.collapsed: expected a number',
    );
  });

  it('refuses a negative minimum joint angle or mismatch, and non-numbers', () => {
    expect(problemsOf(withDriveline((d) => (d.minJointAngle = -0.5)))).toContain(
      'driveline.minJointAngle: must be at least 0',
    );
    expect(problemsOf(withDriveline((d) => (d.maxJointAngleMismatch = -1)))).toContain(
      'driveline.maxJointAngleMismatch: must be at least 0',
    );
    expect(problemsOf(withDriveline((d) => (d.minJointAngle = 'half')))).toContain(
      'driveline.minJointAngle: expected a number',
    );
    expect(problemsOf(withDriveline((d) => (d.maxJointAngleMismatch = null)))).toContain(
      'driveline.maxJointAngleMismatch: expected a number',
    );
    expect(problemsOf(withDriveline((d) => (d.minJointAngle = 120)))).toContain(
      'driveline.minJointAngle: must be at most 90',
    );
  });

  it('refuses an unknown shaft type, listing the two it knows', () => {
    expect(problemsOf(withDriveline((d) => (d.shaft = 'cv')))).toContain(
      "driveline.shaft: expected one of 'single-cardan', 'double-cardan'",
    );
  });
});
