import * as constants from './constants';
import { expectPublished } from './testing/test-helpers';

describe('constants: derived values against their published figures', () => {
  it('ρ0 = p0/(R·T0) is 1.225 kg/m³ (ISO 2533:1975 Table 1)', () => {
    expectPublished(constants.SEA_LEVEL_DENSITY_KGM3, '1.225');
  });

  it('a0 = √(κ·R·T0) is 340.294 m/s (ISO 2533 Table 5) and 661.4786 kt (flight-physics.md)', () => {
    expectPublished(constants.SEA_LEVEL_SPEED_OF_SOUND_MS, '340.294');
    expectPublished(constants.SEA_LEVEL_SPEED_OF_SOUND_KT, '661.4786');
  });

  it('unit definitions: 1 ft = 0.3048 m, 1 kt = 1852/3600 m/s, 1 lb = 0.45359237 kg (1959 agreement; SI Brochure)', () => {
    expect(constants.METRES_PER_FOOT).toBe(0.3048);
    expect(constants.MPS_PER_KNOT * 3600).toBeCloseTo(1852, 9);
    expect(constants.KG_PER_POUND).toBe(0.45359237);
    expect(constants.MPS_PER_MPH).toBeCloseTo(0.44704, 12);
  });

  it('1 inHg is 33.8639 hPa (flight-physics.md) and 13 595.1 kg/m³ · g0 · 25.4 mm (conventional mercury column, from memory)', () => {
    expectPublished(constants.PA_PER_INHG / 100, '33.8639');
    expect(Math.abs(constants.PA_PER_INHG - 13595.1 * 9.80665 * 0.0254)).toBeLessThan(0.001);
  });

  it('the model spans at least −5,000 ft to 104,987 ft (32 km) as issue 3 requires', () => {
    expect(constants.MIN_PRESSURE_ALTITUDE_FT).toBeLessThanOrEqual(-5000);
    expect(constants.MAX_PRESSURE_ALTITUDE_FT).toBeGreaterThanOrEqual(104987);
  });

  it('water vapour is about 5/8 the density of dry air (common practice, no source; flight-physics.md)', () => {
    expect(Math.abs(constants.WATER_VAPOUR_MOLAR_MASS_RATIO - 5 / 8)).toBeLessThan(0.01);
  });
});
