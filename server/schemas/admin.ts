import { z } from 'zod';
import { roles } from '../models';

export const adminUserPatch = z
  .strictObject({
    role: z.enum(roles).optional(),
    disabled: z.boolean().optional(),
  })
  .refine((p) => p.role !== undefined || p.disabled !== undefined, { message: 'give role or disabled' });
