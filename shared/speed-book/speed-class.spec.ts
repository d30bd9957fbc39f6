import { roundingOfClass, speedClassOf, speedRole } from './speed-class';

// Spellings as flight manuals print them (trade usage, from memory); classes and rounding as
// flight-physics.md "Rounding by kind" states them.
describe('speed classes and spellings', () => {
  it.each([
    ['VSO', 'VS0'], ['vs0', 'VS0'], ['VSR0', 'VS0'], ['VS1G', 'VS1'], ['VSR1', 'VS1'], ['VS', 'VS'], ['VMCA', 'VMC'], ['VBG', null],
  ] as const)('%s plays the role %s', (code, role) => {
    expect(speedRole(code)).toBe(role);
  });

  it.each([
    ['VSO', 'stall'], ['VS1G', 'stall'], ['V2', 'minimum'], ['VREF', 'minimum'], ['VA', 'limit'], ['VR', 'takeoff'], ['VY', 'climb'], ['VBG', 'other'],
  ] as const)('%s is inferred as %s', (code, speedClass) => {
    expect(speedClassOf({ code })).toBe(speedClass);
  });

  it('a declared class wins over the code', () => {
    expect(speedClassOf({ code: 'VBG', speedClass: 'minimum' })).toBe('minimum');
  });

  it('rounds stall and minimum up, limits down, the rest nearest', () => {
    expect(roundingOfClass('stall')).toBe('stall-up');
    expect(roundingOfClass('minimum')).toBe('stall-up');
    expect(roundingOfClass('limit')).toBe('limit-down');
    expect(roundingOfClass('climb')).toBe('nearest');
    expect(roundingOfClass('other')).toBe('nearest');
  });
});
