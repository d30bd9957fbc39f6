/**
 * The fleet as the API reads and writes it: aircraft types and airframes
 * (`/api/aircraft-types`, `/api/airframes`). Administrators write; every role reads.
 */
import * as z from 'zod';
import { AIRCRAFT_CATEGORIES } from '../speed-book/revision-content';
import { plainText } from '../text/plain-text';
import { changeSchema } from './change-schema';

const id = z.number().int().positive();

export const aircraftTypeSchema = z.object({
  id,
  designator: z.string(),
  name: z.string(),
  category: z.enum(AIRCRAFT_CATEGORIES),
  engines: z.number().int(),
  ceilingFt: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type AircraftTypeView = z.infer<typeof aircraftTypeSchema>;

const aircraftTypeFields = {
  designator: z
    .string({ error: 'Give the type’s designator.' })
    .check(plainText('The designator'))
    .trim()
    .toUpperCase()
    .regex(/^[A-Z0-9]{2,8}$/, 'A designator is 2 to 8 letters and digits, such as ZZP1.'),
  name: z.string({ error: 'Give the type’s name.' }).check(plainText('The name')).trim().min(1, 'Give the type’s name.').max(120, 'At most 120 characters.'),
  category: z.enum(AIRCRAFT_CATEGORIES, { error: 'Choose piston-single, piston-twin, turboprop or jet.' }),
  engines: z.number({ error: 'Give the number of engines.' }).int('A whole number of engines.').min(1, 'At least one engine.').max(8, 'At most 8 engines.'),
  ceilingFt: z.number({ error: 'Give the ceiling in feet.' }).int('Whole feet.').min(1000, 'At least 1,000 ft.').max(60_000, 'At most 60,000 ft.'),
};

export const createAircraftTypeSchema = z.strictObject(aircraftTypeFields);
export const updateAircraftTypeSchema = changeSchema(aircraftTypeFields);
export type CreateAircraftType = z.infer<typeof createAircraftTypeSchema>;
export type UpdateAircraftType = z.infer<typeof updateAircraftTypeSchema>;

export const aircraftTypeListSchema = z.object({ aircraftTypes: z.array(aircraftTypeSchema) });
export const aircraftTypeResponseSchema = z.object({ aircraftType: aircraftTypeSchema });

/**
 * A registration as states allocate them: a nationality prefix of one or two letters or digits,
 * a hyphen and up to five letters or digits (ZZ-KFA, D-EABC, 9H-ABC), or a US N-number (N123AB).
 * The demo uses the non-allocated prefix ZZ-.
 */
export const registrationSchema = z
  .string({ error: 'Give the registration.' })
  .check(plainText('The registration'))
  .trim()
  .toUpperCase()
  .regex(/^([A-Z0-9]{1,2}-[A-Z0-9]{1,5}|N[1-9][0-9A-Z]{0,4})$/, 'A registration looks like ZZ-KFA: a nationality prefix, a hyphen and up to five letters or digits.');

export const airframeSchema = z.object({
  id,
  registration: z.string(),
  serial: z.string(),
  aircraftTypeId: id,
  active: z.boolean(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type AirframeView = z.infer<typeof airframeSchema>;

const airframeFields = {
  registration: registrationSchema,
  serial: z.string({ error: 'Give the serial number.' }).check(plainText('The serial number')).trim().min(1, 'Give the serial number.').max(40, 'At most 40 characters.'),
  aircraftTypeId: z.number({ error: 'Choose the aircraft type.' }).int().positive('Choose the aircraft type.'),
  active: z.boolean({ error: 'Active is true or false.' }),
};

export const createAirframeSchema = z.strictObject({ ...airframeFields, active: airframeFields.active.default(true) });
export const updateAirframeSchema = changeSchema(airframeFields);
export type CreateAirframe = z.infer<typeof createAirframeSchema>;
export type UpdateAirframe = z.infer<typeof updateAirframeSchema>;

export const airframeListSchema = z.object({ airframes: z.array(airframeSchema) });
export const airframeResponseSchema = z.object({ airframe: airframeSchema });
