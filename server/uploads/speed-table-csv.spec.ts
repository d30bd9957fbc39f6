import { DomainError } from '../errors/domain-error';
import { httpStatusOf } from '../middleware/error-handler';
import { MAX_CSV_ROWS, parseSpeedTableCsv, type PositionErrorUpload, type TabulatedSpeedUpload } from './speed-table-csv';

const positionError = (text: string) => {
  const result = parseSpeedTableCsv(text);
  expect(result.layout).toBe('position-error');
  return result as PositionErrorUpload;
};
const tabulated = (text: string) => {
  const result = parseSpeedTableCsv(text);
  expect(result.layout).toBe('tabulated-speed');
  return result as TabulatedSpeedUpload;
};
const unusable = (text: string): DomainError => {
  try {
    parseSpeedTableCsv(text);
  } catch (error) {
    expect(error).toBeInstanceOf(DomainError);
    expect(httpStatusOf(error as DomainError)).toBe(422);
    return error as DomainError;
  }
  throw new Error('expected the file to be refused');
};

describe('position-error layout', () => {
  it('groups rows by configuration, in file order, as [{ iasKt, casKt }]', () => {
    const result = positionError(
      '\uFEFFConfiguration_Key, IAS_kt ,cas_kt\r\nclean,60,63\r\nclean,80,81.5\r\nclean,120,119\r\n\r\nlanding-flap,50,54\r\nlanding-flap,70,71\r\n',
    );
    expect(result.errors).toEqual([]);
    expect(result.configurations).toEqual([
      { key: 'clean', positionError: [{ iasKt: 60, casKt: 63 }, { iasKt: 80, casKt: 81.5 }, { iasKt: 120, casKt: 119 }] },
      { key: 'landing-flap', positionError: [{ iasKt: 50, casKt: 54 }, { iasKt: 70, casKt: 71 }] },
    ]);
    expect(result.rows.map((row) => row.line)).toEqual([2, 3, 4, 6, 7]);
    expect(result.rows[0]!.values).toEqual({ configuration_key: 'clean', ias_kt: '60', cas_kt: '63' });
  });

  it('refuses keys and codes that the revision content would refuse later (upper case, underscores)', () => {
    const result = positionError('configuration_key,ias_kt,cas_kt\nTakeoff_Flap,60,63\nTakeoff_Flap,80,81\n');
    expect(result.configurations).toEqual([]);
    expect(result.errors).toEqual([
      { line: 2, column: 'configuration_key', reason: expect.stringMatching(/lower-case letters and digits joined by hyphens/) },
      { line: 3, column: 'configuration_key', reason: expect.stringMatching(/lower-case letters and digits joined by hyphens/) },
    ]);
    const speeds = tabulated('speed_code,configuration_key,weight_kg,value_kt\nV_R,clean,900,55\nV_R,clean,1000,58\n');
    expect(speeds.errors.map((error) => error.column)).toEqual(['speed_code', 'speed_code']);
  });

  it('reports each bad row with its line, column and a reason, and leaves the group out', () => {
    const result = positionError(
      [
        'configuration_key,ias_kt,cas_kt', // 1
        'clean,60,63', // 2
        'clean,eighty,81', // 3 not a number
        'clean,80,81', // 4
        'clean,80,82', // 5 duplicate IAS
        'clean,70,75', // 6 goes back
        'clean,90,80', // 7 CAS falls
        'clean,100,150', // 8 implausible correction
        'clean,900,905', // 9 out of range
        'clean,95,96,7', // 10 one value too many
        'clean,96', // 11 one too few
        'clean,"97,5",98', // 12 decimal comma
        'clean,,98', // 13 empty
        'flap 10,60,61', // 14 bad key
        'takeoff-flap,60,62', // 15
        'takeoff-flap,70,71', // 16
        'single,60,61', // 17 only one point
      ].join('\n'),
    );
    expect(result.errors).toEqual([
      { line: 3, column: 'ias_kt', reason: '"eighty" is not a number; enter an IAS in kt.' },
      { line: 5, column: 'ias_kt', reason: 'IAS 80 kt of "clean" is already on line 4; each IAS appears once.' },
      { line: 6, column: 'ias_kt', reason: 'IAS must rise down the table: 70 kt comes after 80 kt (line 4) for "clean".' },
      { line: 7, column: 'cas_kt', reason: 'CAS must rise with IAS: 80 kt is not above 81 kt on line 4 for "clean".' },
      { line: 8, column: 'cas_kt', reason: expect.stringMatching(/by more than 30 kt; check that the columns are in the right order/) },
      { line: 9, column: 'ias_kt', reason: '900 kt is outside 20 to 600 kt, the range accepted for an IAS.' },
      { line: 9, column: 'cas_kt', reason: '905 kt is outside 20 to 600 kt, the range accepted for a CAS.' },
      { line: 10, column: null, reason: 'This row has 4 values; the header has 3 columns.' },
      { line: 11, column: null, reason: 'This row has 2 values; the header has 3 columns.' },
      { line: 12, column: 'ias_kt', reason: 'Use a point as the decimal separator: 97.5, not 97,5.' },
      { line: 13, column: 'ias_kt', reason: 'Enter an IAS in kt; this cell is empty.' },
      { line: 14, column: 'configuration_key', reason: expect.stringMatching(/"flap 10" is not a configuration key/) },
      { line: 17, column: null, reason: '"single" needs at least two rows so that values between them can be interpolated.' },
    ]);
    expect(result.configurations).toEqual([{ key: 'takeoff-flap', positionError: [{ iasKt: 60, casKt: 62 }, { iasKt: 70, casKt: 71 }] }]);
  });

  it('counts lines as an editor does when a quoted value spans two lines', () => {
    const result = positionError('configuration_key,ias_kt,cas_kt\n"clean\nnote",60,61\nclean,x,62\n');
    expect(result.errors.map((e) => [e.line, e.column])).toEqual([
      [2, 'configuration_key'],
      [4, 'ias_kt'],
    ]);
  });

  it('reads semicolon-separated files too', () => {
    expect(positionError('configuration_key;ias_kt;cas_kt\nclean;60;62\nclean;80;81\n').configurations).toHaveLength(1);
  });
});

describe('tabulated-speed layout', () => {
  it('builds a weight-only table', () => {
    const result = tabulated('speed_code,configuration_key,weight_kg,value_kt\nVR,takeoff-flap,900,52\nVR,takeoff-flap,1100,57\nVR,takeoff-flap,1250,60\n');
    expect(result.errors).toEqual([]);
    expect(result.speeds).toEqual([{ code: 'VR', configurationKey: 'takeoff-flap', table: { byWeightKg: [900, 1100, 1250], valuesKt: [52, 57, 60] } }]);
  });

  it('nests values weight → pressure altitude → OAT and keeps speeds apart by code and configuration', () => {
    const lines = ['speed_code,configuration_key,weight_kg,pressure_altitude_ft,oat_c,value_kt'];
    for (const w of [5000, 6000]) for (const p of [0, 5000]) for (const t of [-10, 30]) lines.push(`V1,takeoff-flap,${w},${p},${t},${(w / 100 + p / 1000 + t / 10).toFixed(1)}`);
    lines.push('VREF,landing-flap,5000,0,15,95', 'VREF,landing-flap,6000,0,15,102', 'VREF,landing-flap,5000,5000,15,96', 'VREF,landing-flap,6000,5000,15,103');
    const result = tabulated(lines.join('\n'));
    // The VREF rows are out of order: 5000 kg at 5000 ft comes after 6000 kg.
    expect(result.errors).toEqual([{ line: 12, column: 'weight_kg', reason: expect.stringMatching(/must be sorted by weight, then pressure altitude, then OAT/) }]);
    expect(result.speeds).toEqual([
      {
        code: 'V1',
        configurationKey: 'takeoff-flap',
        table: {
          byWeightKg: [5000, 6000],
          byPressureAltitudeFt: [0, 5000],
          byOatC: [-10, 30],
          valuesKt: [
            [
              [49, 53],
              [54, 58],
            ],
            [
              [59, 63],
              [64, 68],
            ],
          ],
        },
      },
    ]);
  });

  it('names each missing grid point, duplicates and rows out of order', () => {
    const result = tabulated(
      [
        'speed_code,configuration_key,weight_kg,pressure_altitude_ft,value_kt', // 1
        'VX,clean,900,0,60', // 2
        'VX,clean,900,4000,62', // 3
        'VX,clean,1100,0,64', // 4  (1100 kg at 4000 ft missing)
        'VY,clean,900,0,70', // 5
        'VY,clean,900,0,71', // 6 duplicate
        'VS1,clean,1100,0,48', // 7
        'VS1,clean,900,0,44', // 8 out of order
        'VS0,landing-flap,900,0,40', // 9
        'VS0,landing-flap,1100,0,abc', // 10
        'V R,clean,900,0,40', // 11 bad code
      ].join('\n'),
    );
    expect(result.errors).toEqual([
      { line: 2, column: 'value_kt', reason: "No row for VX at 1100 kg, 4000 ft: every combination of the table's weights, altitudes and temperatures needs one." },
      { line: 6, column: null, reason: 'VY at 900 kg, 0 ft is already on line 5; each grid point appears once.' },
      { line: 8, column: 'weight_kg', reason: expect.stringMatching(/^Rows of VS1 must be sorted .* this row comes after line 7/) },
      { line: 10, column: 'value_kt', reason: '"abc" is not a number; enter a speed in kt.' },
      { line: 11, column: 'speed_code', reason: expect.stringMatching(/"V R" is not a speed code/) },
    ]);
    expect(result.speeds).toEqual([]);
  });

  it('needs two values on every axis it has', () => {
    const result = tabulated('speed_code,configuration_key,weight_kg,oat_c,value_kt\nVREF,landing-flap,5000,15,95\nVREF,landing-flap,6000,15,102\n');
    expect(result.errors).toEqual([
      { line: 2, column: 'oat_c', reason: 'VREF (landing-flap) needs at least two values of oat_c so that values between them can be interpolated.' },
    ]);
    expect(result.speeds).toEqual([]);
  });

  it('checks the ranges of every axis', () => {
    const result = tabulated('speed_code,configuration_key,weight_kg,oat_c,value_kt\nVR,to,50,15,50\nVR,to,900,75,50\nVR,to,1000,15,5\n');
    expect(result.errors).toEqual([
      { line: 2, column: 'weight_kg', reason: '50 kg is outside 100 to 400000 kg, the range accepted for a weight.' },
      { line: 3, column: 'oat_c', reason: '75 °C is outside -90 to 60 °C, the range accepted for an OAT.' },
      { line: 4, column: 'value_kt', reason: '5 kt is outside 10 to 700 kt, the range accepted for a speed.' },
    ]);
  });
});

describe('files that are not usable at all', () => {
  it('refuses an unknown header with both layouts named', () => {
    const error = unusable('speed,knots\nVR,55\n');
    expect(error.message).toMatch(/columns this upload does not know \("speed", "knots"\)/);
    expect(error.message).toMatch(/configuration_key,ias_kt,cas_kt/);
    expect(error.fields?.['file']).toBe(error.message);
  });

  it('refuses an empty file, a repeated column, binary content, an open quote and too many rows', () => {
    expect(unusable('\n\n').message).toMatch(/empty/);
    expect(unusable('configuration_key,ias_kt,ias_kt\n').message).toMatch(/"ias_kt" appears twice/);
    expect(unusable('MZ\u0000\u0000binary').message).toMatch(/not text/);
    expect(unusable('configuration_key,ias_kt,cas_kt\n"clean,60,61\n').message).toMatch(/not closed/);
    const many = ['configuration_key,ias_kt,cas_kt', ...Array.from({ length: MAX_CSV_ROWS + 1 }, (_, i) => `c${i},60,61`)].join('\n');
    expect(unusable(many).message).toMatch(/more than 5000 rows/);
  });
});

describe('bounds on the work of one upload', () => {
  // Security issue 12, finding 2: the grid is sized from its axes before it is built.
  it('refuses a grid over 5,000 points before building it, saying how many it would need and how many rows it has', () => {
    const rows = Array.from({ length: 80 }, (_, i) => `VR,takeoff-flap,${1000 + i},${i * 100},${60 + i * 0.1}`);
    const error = unusable(`speed_code,configuration_key,weight_kg,pressure_altitude_ft,value_kt\n${rows.join('\n')}\n`);
    expect(error.code).toBe('csv_too_large');
    expect(error.message).toBe(
      'VR (takeoff-flap) would need 6,400 grid points (80 weights × 80 pressure altitudes), one row each, and the file has 80 rows for it; a table holds at most 5,000 grid points. Every weight must be tabulated at the same altitudes and temperatures.',
    );
  });

  it('refuses an axis of more than 100 values even when the grid is small', () => {
    const rows = Array.from({ length: 101 }, (_, i) => `VS,clean,${1000 + i},${50 + i * 0.1}`);
    expect(unusable(`speed_code,configuration_key,weight_kg,value_kt\n${rows.join('\n')}\n`).message).toContain('an axis holds at most 100 values');
  });

  it('still lists the missing points of a grid within bounds', () => {
    const result = tabulated('speed_code,configuration_key,weight_kg,pressure_altitude_ft,value_kt\nVR,takeoff-flap,900,0,52\nVR,takeoff-flap,1100,4000,57\n');
    expect(result.speeds).toEqual([]);
    expect(result.errors.filter((error) => error.reason.startsWith('No row for VR'))).toHaveLength(2);
  });
});

