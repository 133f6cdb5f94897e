import { z } from 'zod';

export const HealthResponse = z.object({
  status: z.enum(['ok', 'degraded']),
  version: z.string(),
  uptimeSeconds: z.number(),
  database: z.object({
    status: z.enum(['ok', 'down']),
    pendingMigrations: z.number().int(),
  }),
});
export type HealthResponse = z.infer<typeof HealthResponse>;
