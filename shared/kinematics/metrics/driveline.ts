/**
 * Driveshaft readings: shaft length, plunge from ride, and the operating angle of each
 * joint (the angle between the shafts it joins, in 3-D, so a joint bent in both views gets
 * its compound angle — docs/references.md, driveline installation guides).
 */
import { radToDeg } from '../../units';
import type { DrivelineReading } from '../types';
import { vecAngle, vecDistance, vecSub, type Vec3 } from '../vec';

/**
 * `output`/`outputAxis` (frame: the joint and a point ahead of it on the gearbox shaft),
 * `pinion`/`pinionAxis` (axle: the joint and a point behind it on the pinion shaft), mm.
 */
export function drivelineReading(
  output: Vec3,
  outputAxis: Vec3,
  pinion: Vec3,
  pinionAxis: Vec3,
  rideLength: number,
): DrivelineReading {
  const shaft = vecSub(pinion, output);
  const gearbox = vecSub(output, outputAxis); // pointing rearward into the joint
  const pinionShaft = vecSub(pinionAxis, pinion); // pointing rearward out of the joint
  const length = vecDistance(output, pinion);
  return {
    length,
    plunge: length - rideLength,
    outputAngle: radToDeg(vecAngle(gearbox, shaft)),
    pinionAngle: radToDeg(vecAngle(shaft, pinionShaft)),
  };
}
