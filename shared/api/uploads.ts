import * as z from 'zod';
import { STATED_SPEED_UNITS, STATED_WEIGHT_UNITS } from '../speed-book/content-shape';

/**
 * `POST /api/uploads/speed-table`: the parsed CSV for the engineer's preview. The layouts are
 * documented in server/uploads/speed-table-csv.ts and DEVELOPERS.md.
 */
export const csvRowErrorSchema = z.object({
  line: z.number().int().positive(),
  column: z.string().nullable(),
  reason: z.string(),
});
export type CsvRowError = z.infer<typeof csvRowErrorSchema>;

const uploadBase = {
  columns: z.array(z.string()),
  rows: z.array(z.object({ line: z.number().int().positive(), values: z.record(z.string(), z.string()) })),
  errors: z.array(csvRowErrorSchema),
  /** The units the file's header states; `rows` keep its figures as written, the parsed tables are in kt and kg. */
  statedUnits: z.object({ speed: z.enum(STATED_SPEED_UNITS).optional(), weight: z.enum(STATED_WEIGHT_UNITS).optional() }),
};

type Nested = number[] | Nested[];
const nestedNumbers: z.ZodType<Nested> = z.lazy(() => z.union([z.array(z.number()), z.array(nestedNumbers)]));

export const positionErrorUploadSchema = z.object({
  layout: z.literal('position-error'),
  ...uploadBase,
  configurations: z.array(z.object({ key: z.string(), positionError: z.array(z.object({ iasKt: z.number(), casKt: z.number() })) })),
});

export const tabulatedSpeedUploadSchema = z.object({
  layout: z.literal('tabulated-speed'),
  ...uploadBase,
  speeds: z.array(
    z.object({
      code: z.string(),
      configurationKey: z.string(),
      table: z.object({
        byWeightKg: z.array(z.number()),
        byPressureAltitudeFt: z.array(z.number()).optional(),
        byOatC: z.array(z.number()).optional(),
        valuesKt: nestedNumbers,
      }),
    }),
  ),
});

export const speedTableUploadSchema = z.discriminatedUnion('layout', [positionErrorUploadSchema, tabulatedSpeedUploadSchema]);
export type SpeedTableUploadResponse = z.infer<typeof speedTableUploadSchema>;
