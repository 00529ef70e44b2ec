/**
 * Wheel attitude from a carrier's pose: signs of camber and toe on both sides (plain
 * geometry, docs/sketch-format.md sign conventions), a wheel turning about its own axis, the
 * track and fore-aft changes, and a given static spin axis.
 */
import { describe, expect, it } from 'vitest';
import { multiply, rotationMatrix } from 'mathjs';
import { wheelAttitude } from '../../../shared/kinematics/metrics/wheel';
import { poseZero } from '../../../shared/kinematics/pose';

/** Angles agree to this (deg): round-off of a few trigonometric calls. */
const ANGLE_TOLERANCE_DEG = 1e-9;
/** Lengths agree to this (mm). */
const LENGTH_TOLERANCE_MM = 1e-9;
const close = (a: number, b: number, tol: number) => expect(Math.abs(a - b)).toBeLessThan(tol);

const left = { x: 0, y: 800, z: 400 };
const right = { x: 0, y: -800, z: 400 };

describe('wheel attitude', () => {
  it('is all zero at ride', () => {
    const a = wheelAttitude(poseZero(), left, left, 'left');
    expect(a).toEqual({ camberChange: 0, toeChange: 0, trackChange: 0, foreAftShift: 0 });
  });

  it('roll of the carrier is camber: positive roll tips the left wheel top in, the right wheel top out', () => {
    // Roll about x by +3° (ISO 8855: lifts the left side) turns the left wheel's top towards −y (inboard).
    const pose = { ...poseZero(), roll: 3 };
    close(wheelAttitude(pose, left, left, 'left').camberChange, -3, ANGLE_TOLERANCE_DEG);
    close(wheelAttitude(pose, right, right, 'right').camberChange, 3, ANGLE_TOLERANCE_DEG);
    close(wheelAttitude(pose, left, left, 'left').toeChange, 0, ANGLE_TOLERANCE_DEG);
  });

  it('yaw of the carrier is toe: nose-left yaw is toe-out on the left, toe-in on the right', () => {
    const pose = { ...poseZero(), yaw: 2 };
    close(wheelAttitude(pose, left, left, 'left').toeChange, -2, ANGLE_TOLERANCE_DEG);
    close(wheelAttitude(pose, right, right, 'right').toeChange, 2, ANGLE_TOLERANCE_DEG);
    close(wheelAttitude(pose, left, left, 'left').camberChange, 0, ANGLE_TOLERANCE_DEG);
  });

  it('pitch (the wheel turning about its own axis) changes neither camber nor toe', () => {
    const a = wheelAttitude({ ...poseZero(), pitch: 25 }, left, left, 'left');
    close(a.camberChange, 0, ANGLE_TOLERANCE_DEG);
    close(a.toeChange, 0, ANGLE_TOLERANCE_DEG);
  });

  it('reads track and fore-aft change off the placed wheel centre', () => {
    // Carrier reference 400 mm inboard of the wheel centre; roll 10° swings the centre up and in.
    const ref = { x: 0, y: 400, z: 400 };
    const a = wheelAttitude({ ...poseZero(), x: 5, roll: 10 }, ref, left, 'left');
    const th = (10 * Math.PI) / 180;
    close(a.trackChange, 400 * Math.cos(th) + 400 - 800, LENGTH_TOLERANCE_MM);
    close(a.foreAftShift, 5, LENGTH_TOLERANCE_MM);
    // Mirror: the right wheel moving outward (−y) widens the track too.
    const b = wheelAttitude({ ...poseZero(), y: -7 }, right, right, 'right');
    close(b.trackChange, 7, LENGTH_TOLERANCE_MM);
  });

  it('matches the rear-view and top-view angles of the axis rotated by mathjs (compound rotation)', () => {
    const [r, p, y] = [4, -6, 3];
    const rad = (d: number) => (d * Math.PI) / 180;
    // Independent rotation: mathjs rotationMatrix about z, y, x composed as Rz·Ry·Rx (ISO 8855, docs/sketch-format.md).
    const R = multiply(
      multiply(rotationMatrix(rad(y), [0, 0, 1]), rotationMatrix(rad(p), [0, 1, 0])),
      rotationMatrix(rad(r), [1, 0, 0]),
    ) as unknown as number[][];
    const n = multiply(R, [0, 1, 0]) as unknown as number[];
    const a = wheelAttitude({ ...poseZero(), roll: r, pitch: p, yaw: y }, left, left, 'left');
    close(a.camberChange, (Math.atan2(-n[2], n[1]) * 180) / Math.PI, ANGLE_TOLERANCE_DEG);
    close(a.toeChange, (Math.atan2(n[0], n[1]) * 180) / Math.PI, ANGLE_TOLERANCE_DEG);
  });

  it('reports changes from a given static spin axis (2° static negative camber stays a zero change)', () => {
    const th = (2 * Math.PI) / 180;
    const axis = { x: 0, y: Math.cos(th), z: Math.sin(th) };
    const still = wheelAttitude(poseZero(), left, left, 'left', axis);
    close(still.camberChange, 0, ANGLE_TOLERANCE_DEG);
    const rolled = wheelAttitude({ ...poseZero(), roll: 1 }, left, left, 'left', axis);
    close(rolled.camberChange, -1, ANGLE_TOLERANCE_DEG);
  });
});
