import { DomainError } from '../errors/domain-error';
import { httpStatusOf } from '../middleware/error-handler';
import { parseSpeedTableCsv, type PositionErrorUpload, type TabulatedSpeedUpload } from './speed-table-csv';

// Exact factors: 1 lb = 0.453 592 37 kg and 1 mile = 1 609.344 m (international yard and pound
// agreement, 1959); 1 nautical mile = 1 852 m (SI brochure), so 1 mph = 1609.344/1852 kt and
// 1 km/h = 1/1.852 kt.
const KT_PER_MPH = 1609.344 / 1852;
const KT_PER_KMH = 1 / 1.852;
const KG_PER_LB = 0.45359237;

const refusal = (text: string): DomainError => {
  try {
    parseSpeedTableCsv(text);
  } catch (error) {
    expect(error).toBeInstanceOf(DomainError);
    expect(httpStatusOf(error as DomainError)).toBe(422);
    return error as DomainError;
  }
  throw new Error('expected the file to be refused');
};

describe('speed-table CSV in the flight manual’s own units', () => {
  it('reads a tabulated speed in lb and mph, stores kg and kt, keeps the rows as written and names the units', () => {
    const result = parseSpeedTableCsv('speed_code,configuration_key,Weight_LB,value_mph\nVR,takeoff-flap,1900,60\nVR,takeoff-flap,2400,66\n') as TabulatedSpeedUpload;
    expect(result.layout).toBe('tabulated-speed');
    expect(result.errors).toEqual([]);
    expect(result.statedUnits).toEqual({ weight: 'lb', speed: 'mph' });
    expect(result.rows[0]!.values).toEqual({ speed_code: 'VR', configuration_key: 'takeoff-flap', weight_lb: '1900', value_mph: '60' });
    const table = result.speeds[0]!.table;
    expect(table.byWeightKg[0]).toBeCloseTo(1900 * KG_PER_LB, 9);
    expect(table.byWeightKg[1]).toBeCloseTo(2400 * KG_PER_LB, 9);
    expect((table.valuesKt as number[])[0]).toBeCloseTo(60 * KT_PER_MPH, 9);
    expect((table.valuesKt as number[])[1]).toBeCloseTo(66 * KT_PER_MPH, 9);
  });

  it('reads a position-error table in km/h and gives its sentences in km/h', () => {
    const good = parseSpeedTableCsv('configuration_key,ias_kmh,cas_kmh\nclean,100,105\nclean,200,198\n') as PositionErrorUpload;
    expect(good.errors).toEqual([]);
    expect(good.statedUnits).toEqual({ speed: 'kmh' });
    expect(good.configurations[0]!.positionError[0]!.iasKt).toBeCloseTo(100 * KT_PER_KMH, 9);
    expect(good.configurations[0]!.positionError[1]!.casKt).toBeCloseTo(198 * KT_PER_KMH, 9);

    const bad = parseSpeedTableCsv('configuration_key,ias_kmh,cas_kmh\nclean,100,105\nclean,90,95\nclean,200,300\nclean,2000,2001\n') as PositionErrorUpload;
    expect(bad.configurations).toEqual([]);
    expect(bad.errors).toEqual([
      { line: 3, column: 'ias_kmh', reason: 'IAS must rise down the table: 90 km/h comes after 100 km/h (line 2) for "clean".' },
      // 30 kt = 55.56 km/h
      { line: 4, column: 'cas_kmh', reason: 'CAS 300 km/h differs from IAS 200 km/h by more than 55 km/h (30 kt); check that the columns are in the right order.' },
      // 20–600 kt = 37.04–1111.2 km/h, kept inside
      { line: 5, column: 'ias_kmh', reason: '2000 km/h is outside 38 to 1111 km/h, the range accepted for an IAS.' },
      { line: 5, column: 'cas_kmh', reason: '2001 km/h is outside 38 to 1111 km/h, the range accepted for a CAS.' },
    ]);
  });

  it('checks ranges in the file’s unit and names missing points in it', () => {
    const result = parseSpeedTableCsv(
      'speed_code,configuration_key,weight_lb,pressure_altitude_ft,value_mph\nVX,clean,1800,0,5\nVX,clean,1800,4000,70\nVX,clean,2300,0,72\nVY,clean,50,0,80\n',
    ) as TabulatedSpeedUpload;
    expect(result.errors).toEqual([
      // 10–700 kt = 11.5–805.5 mph; 100 kg = 220.5 lb
      { line: 2, column: 'value_mph', reason: '5 mph is outside 12 to 805 mph, the range accepted for a speed.' },
      { line: 5, column: 'weight_lb', reason: '50 lb is outside 221 to 881849 lb, the range accepted for a weight.' },
    ]);
    const missing = parseSpeedTableCsv('speed_code,configuration_key,weight_lb,pressure_altitude_ft,value_mph\nVX,clean,1800,0,70\nVX,clean,1800,4000,71\nVX,clean,2300,0,72\n');
    expect(missing.errors).toEqual([
      { line: 2, column: 'value_mph', reason: "No row for VX at 2300 lb, 4000 ft: every combination of the table's weights, altitudes and temperatures needs one." },
    ]);
  });

  it('names kg and kt files’ units too', () => {
    expect(parseSpeedTableCsv('configuration_key,ias_kt,cas_kt\nclean,60,62\nclean,80,81\n').statedUnits).toEqual({ speed: 'kt' });
    expect(parseSpeedTableCsv('speed_code,configuration_key,weight_kg,value_kt\nVR,to,900,52\nVR,to,1100,57\n').statedUnits).toEqual({ weight: 'kg', speed: 'kt' });
  });

  it('refuses a file that gives one quantity in two units, naming the header line and the column', () => {
    const speeds = refusal('configuration_key,ias_mph,cas_kt\nclean,60,52\nclean,80,70\n');
    expect(speeds.message).toBe(
      'Line 1, column "cas_kt": this file already gives speeds in mph (column "ias_mph"). Give every speed of one file in one unit, as the flight manual prints it.',
    );
    expect(speeds.fields).toEqual({ file: speeds.message });
    const weights = refusal('\nspeed_code,configuration_key,weight_kg,weight_lb,value_kt\nVR,to,900,1984,52\n');
    expect(weights.message).toMatch(/^Line 2, column "weight_lb": this file already gives weights in kg \(column "weight_kg"\)/);
  });

  it('refuses units of no layout of ours (stone, m/s) as unknown columns', () => {
    expect(refusal('speed_code,configuration_key,weight_st,value_kt\nVR,to,900,52\n').message).toMatch(/does not know \("weight_st"\)/);
    expect(refusal('configuration_key,ias_mps,cas_mps\nclean,30,31\n').message).toMatch(/does not know \("ias_mps", "cas_mps"\)/);
  });
});
