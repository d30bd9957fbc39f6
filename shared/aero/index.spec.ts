import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import * as aero from './index';

// Library structure rules of the project (style.md, issue 3); no outside source.
describe('the barrel', () => {
  it('exports exactly the documented public API', () => {
    expect(Object.keys(aero).sort()).toEqual(
      [
        // errors
        'AERO_INPUT_ERROR_CODES', 'AeroInputError',
        // constants
        'GAS_CONSTANT_AIR_JKGK', 'HEAT_CAPACITY_RATIO', 'KG_PER_POUND', 'MAX_ISA_DEVIATION_C', 'MAX_OAT_C',
        'MAX_PRESSURE_ALTITUDE_FT', 'MAX_QNH_HPA', 'METRES_PER_FOOT', 'MIN_AIRSPEED_KT', 'MIN_MACH', 'MIN_OAT_C',
        'MIN_PRESSURE_ALTITUDE_FT', 'MIN_QNH_HPA', 'MPS_PER_KMH', 'MPS_PER_KNOT', 'MPS_PER_MPH', 'PA_PER_INHG',
        'SEA_LEVEL_DENSITY_KGM3', 'SEA_LEVEL_PRESSURE_PA', 'SEA_LEVEL_SPEED_OF_SOUND_KT', 'SEA_LEVEL_SPEED_OF_SOUND_MS',
        'SEA_LEVEL_TEMPERATURE_K', 'STANDARD_GRAVITY_MS2', 'ZERO_CELSIUS_K',
        // units and rounding
        'cToF', 'cToK', 'fToC', 'ftToM', 'hpaToInhg', 'inhgToHpa', 'kToC', 'kgToLb', 'kmhToKt', 'ktToKmh', 'ktToMph',
        'ktToMps', 'lbToKg', 'mToFt', 'mphToKt', 'mpsToKt', 'roundLimitKt', 'roundSpeedKt', 'roundStallKt',
        // atmosphere and altimetry
        'geometricAltitudeM', 'geopotentialAltitudeM', 'isa', 'isaDeviationC', 'isaTemperatureC',
        'pressureAltitudeFtForPressureHpa', 'densityAltitudeFt', 'pressureAltitudeFt', 'stationPressureHpa',
        // speeds
        'convertAirspeed', 'casToIasKt', 'checkPositionErrorTable', 'iasToCasKt', 'crossoverAltitudeFt',
        'weightScaledSpeedKt', 'checkSpeedTable', 'interpolateSpeedTableKt', 'loadFactorInTurn', 'stallSpeedInTurnKt',
        // temperature
        'tatToSatC',
      ].sort(),
    );
  });
});

describe('purity of shared/aero', () => {
  const sources = readdirSync(__dirname).filter((file) => file.endsWith('.ts') && !file.endsWith('.spec.ts'));
  const code = (file: string) =>
    readFileSync(join(__dirname, file), 'utf8')
      .replace(/\/\*[\s\S]*?\*\//g, '')
      .replace(/\/\/.*$/gm, '')
      .replace(/(['`])(?:\\.|(?!\1)[^\\])*\1/g, "''");

  it.each(sources)('%s imports only sibling modules', (file) => {
    const imports = [...readFileSync(join(__dirname, file), 'utf8').matchAll(/from '([^']+)'/g)].map((match) => match[1]);
    for (const specifier of imports) expect(specifier).toMatch(/^\.\/[a-z-]+$/);
  });

  it.each(sources)('%s uses no I/O, DOM, Node or clock globals', (file) => {
    expect(code(file)).not.toMatch(/\b(window|document|navigator|localStorage|fetch|XMLHttpRequest|process|require|console|Date|setTimeout|globalThis)\b/);
  });
});
