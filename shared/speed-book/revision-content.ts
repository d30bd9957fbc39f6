/**
 * The content of a speed-book revision: one schema for client and server. What the engineer
 * enters from the flight manual, checked so that every figure a card needs can be computed.
 * Field by field in `content-shape.ts`, the rules across fields in `content-rules.ts`.
 *
 * Units are in every name. Limit speeds are in the basis `indicatorMarkingBasis`; the first
 * configuration is the cruise (clean) configuration through which VNO, VNE and VMO are read.
 */
import * as z from 'zod/mini';
import { revisionContentShape } from './content-shape';
import { contentRuleIssues } from './content-rules';

export {
  AIRCRAFT_CATEGORIES,
  SPEED_BASES,
  SPEED_PHASES,
  configurationKeySchema,
  configurationSchema,
  speedCodeSchema,
  speedSchema,
} from './content-shape';

export const REVISION_SCHEMA_VERSION = 1;

export const revisionContentSchema = revisionContentShape.check(
  z.superRefine((content, ctx) => {
    for (const issue of contentRuleIssues(content)) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
  }),
);

export type RevisionContent = z.infer<typeof revisionContentSchema>;
export type AircraftCategory = RevisionContent['aircraft']['category'];
export type SpeedBasis = RevisionContent['indicatorMarkingBasis'];
export type SpeedPhase = RevisionContent['speeds'][number]['phase'];
export type Configuration = RevisionContent['configurations'][number];
export type PositionErrorPoint = Configuration['positionError'][number];
export type Speed = RevisionContent['speeds'][number];
export type TabulatedSpeed = Extract<Speed, { kind: 'tabulated' }>;
export type Limits = RevisionContent['limits'];

/**
 * Field path → sentence for every problem of `value` as revision content; empty when it is
 * complete and consistent (what submitting for review requires).
 */
export function revisionContentProblems(value: unknown): Record<string, string> {
  const result = revisionContentSchema.safeParse(value);
  if (result.success) return {};
  const fields: Record<string, string> = {};
  for (const issue of result.error.issues) {
    const base = issue.path.map(String);
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) fields[[...base, key].join('.')] ??= 'This field is not expected here.';
      continue;
    }
    fields[base.join('.') || '(content)'] ??= issue.message;
  }
  return fields;
}
