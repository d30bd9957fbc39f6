import * as z from 'zod';
import { COVERAGE_OUTCOMES, type CoverageReport } from '../card/coverage-report';

/**
 * The coverage report as the API sends it (`shared/card/coverage-report.ts` is the type), and the
 * answers of the routes that carry it:
 *
 * - `GET /api/revisions/:id/coverage` → `{ report }`
 * - `POST /api/revisions/coverage` with `{ content }` → `{ report }` (the editor's unsaved content)
 * - `POST /api/revisions/:id/submit` and `…/approve` → 422 `{ error: { code: 'coverage_failed', message, report } }`
 *
 * Every number is finite: a report that carried NaN or Infinity would be a broken sweep, and the
 * client refuses it rather than draw it.
 */

const finite = z.number().refine(Number.isFinite, 'Every figure of a coverage report is finite.');
const range = z.tuple([finite, finite]);
const phaseEnvelope = z.object({ pressureAltitudeFt: range, oatC: range, weightKg: range });

export const coverageOutcomeSchema = z.enum(COVERAGE_OUTCOMES);

export const coverageCellSchema = z.object({
  weightKg: finite,
  pressureAltitudeFt: finite,
  oatC: finite,
  outcome: coverageOutcomeSchema,
  reason: z.string().optional(),
  ruleIds: z.array(z.string()).optional(),
});

/** Axis lengths are bounded so that a picture never tries to draw an unbounded grid. */
const MAX_AXIS_POINTS = 200;

export const coverageSheetSchema = z
  .object({
    phase: z.enum(['takeoff', 'landing']),
    configurationKey: z.string(),
    configurationLabel: z.string(),
    grid: z.object({
      weightsKg: z.array(finite).max(MAX_AXIS_POINTS),
      pressureAltitudesFt: z.array(finite).max(MAX_AXIS_POINTS),
      oatsC: z.array(finite).max(MAX_AXIS_POINTS),
    }),
    cells: z.array(coverageCellSchema),
  })
  .refine((sheet) => sheet.cells.length === sheet.grid.weightsKg.length * sheet.grid.pressureAltitudesFt.length * sheet.grid.oatsC.length, {
    message: 'A sheet holds one cell per grid point.',
    path: ['cells'],
  });

export const coverageRuleFindingSchema = z.object({
  ruleId: z.string(),
  title: z.string(),
  source: z.string(),
  brokenAt: z.number().int().nonnegative(),
  firstMessage: z.string(),
  exception: z.string().optional(),
});

const count = z.number().int().nonnegative();

export const coverageReportSchema = z.object({
  envelope: z.object({ takeoff: phaseEnvelope, landing: phaseEnvelope }),
  sheets: z.array(coverageSheetSchema),
  rules: z.array(coverageRuleFindingSchema),
  counts: z.object({ points: count, issued: count, refused: count, ruleBroken: count }),
  passes: z.boolean(),
});

/** `GET /api/revisions/:id/coverage` and `POST /api/revisions/coverage`. */
export const coverageResponseSchema = z.object({ report: coverageReportSchema });
export type CoverageResponse = z.infer<typeof coverageResponseSchema>;

/** `POST /api/revisions/coverage`: the content as it stands in the editor (checked by the server). */
export const coverageRequestSchema = z.object({ content: z.record(z.string(), z.unknown()) });

/**
 * The 422 of `POST /api/revisions/:id/submit` (and of approve) when the envelope proof fails: the
 * error middleware's usual `{ error: { code, message } }` with the report inside the error.
 */
export const coverageFailedSchema = z
  .object({ error: z.object({ code: z.literal('coverage_failed'), message: z.string(), report: coverageReportSchema }) })
  .transform((body) => ({ code: 'coverage_failed' as const, message: body.error.message, report: body.error.report }));
export type CoverageFailed = z.output<typeof coverageFailedSchema>;

// The schema and the contract's type must describe the same thing: either drifting breaks the build.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const schemaMatchesContract: Same<DeepMutable<z.output<typeof coverageReportSchema>>, DeepMutable<CoverageReport>> = true;
void schemaMatchesContract;

type DeepMutable<T> = T extends readonly [infer A, infer B]
  ? [DeepMutable<A>, DeepMutable<B>]
  : T extends readonly (infer U)[]
    ? DeepMutable<U>[]
    : T extends object
      ? { -readonly [K in keyof T]: DeepMutable<T[K]> }
      : T;
