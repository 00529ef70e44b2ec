/**
 * The query of the CSV downloads (sweep and hardpoint table): the length unit of their numbers,
 * millimetres unless `units=in` asks for inches.
 */
import { z } from 'zod';

export const exportQuery = z.object({ units: z.enum(['mm', 'in']).default('mm') });
export type ExportQuery = z.infer<typeof exportQuery>;
