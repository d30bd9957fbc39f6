/**
 * The health answers for load balancers and supervisors (README, "Running it for your
 * operator"): liveness says the process answers, readiness that it should get traffic.
 * `GET /api/health` itself keeps its schema, `healthSchema` in `./auth`.
 */
import * as z from 'zod';

/** `GET /api/health/live`: always 200 while the process can answer at all. */
export const livenessSchema = z.object({ status: z.literal('live') });

/** Why an instance should get no traffic now. */
export const NOT_READY_REASONS = ['shutting_down', 'database_down', 'migrations_pending'] as const;
export type NotReadyReason = (typeof NOT_READY_REASONS)[number];

/**
 * `GET /api/health/ready`: 200 when the database answers and has every migration this build
 * holds (a database migrated further by a newer build is ready too: upgrades migrate first);
 * 503 with the reason and a sentence otherwise.
 */
export const readinessSchema = z.discriminatedUnion('status', [
  z.object({ status: z.literal('ready'), db: z.literal('ok'), migrations: z.object({ applied: z.number().int(), inBuild: z.number().int() }) }),
  z.object({ status: z.literal('not-ready'), reason: z.enum(NOT_READY_REASONS), message: z.string(), pending: z.array(z.string()).optional() }),
]);
export type Readiness = z.infer<typeof readinessSchema>;
