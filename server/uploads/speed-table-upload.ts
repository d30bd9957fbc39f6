/**
 * What a speed-table upload gives back: the rows as written, the problems, the units stated,
 * and the parsed tables, typed from the shared revision-content schemas (so a preview that
 * passes is the shape a draft takes).
 */
import type * as z from 'zod';
import type { positionErrorPointSchema, tabulatedSpeedSchema } from '@shared/speed-book/content-shape';
import type { CsvRowError } from './csv-problems';
import type { CsvUnits } from './csv-units';

export interface CsvRow {
  line: number;
  values: Record<string, string>;
}

type TabulatedSpeed = z.infer<typeof tabulatedSpeedSchema>;

/** One IAS/CAS point of a position-error table, in kt. */
export type PositionErrorPoint = z.infer<typeof positionErrorPointSchema>;

/** A tabulated speed's axes and values, in kg and kt (`valuesKt` nests weight → pressure altitude → OAT). */
export type TabulatedSpeedTable = Pick<TabulatedSpeed, 'byWeightKg' | 'byPressureAltitudeFt' | 'byOatC' | 'valuesKt'>;

/** Nested weight → pressure altitude → OAT, as many levels as there are axes. */
export type NestedNumbers = TabulatedSpeedTable['valuesKt'];

interface UploadBase {
  columns: string[];
  rows: CsvRow[];
  errors: CsvRowError[];
  /** The units the header states (rows keep the figures as written; the parsed tables are in kt and kg). */
  statedUnits: CsvUnits['detected'];
}

export interface PositionErrorUpload extends UploadBase {
  layout: 'position-error';
  configurations: { key: TabulatedSpeed['configurationKey']; positionError: PositionErrorPoint[] }[];
}

export interface TabulatedSpeedUpload extends UploadBase {
  layout: 'tabulated-speed';
  speeds: { code: TabulatedSpeed['code']; configurationKey: TabulatedSpeed['configurationKey']; table: TabulatedSpeedTable }[];
}

export type SpeedTableUpload = PositionErrorUpload | TabulatedSpeedUpload;

export const LAYOUT_HELP =
  'Use one of the two layouts: a position-error table with the columns configuration_key,ias_kt,cas_kt, ' +
  'or a tabulated speed with speed_code,configuration_key,weight_kg,value_kt (and optionally pressure_altitude_ft and oat_c). ' +
  'Weights may be given in lb (weight_lb) and speeds in mph or km/h (ias_mph, cas_kmh, value_mph…), one unit per quantity.';
