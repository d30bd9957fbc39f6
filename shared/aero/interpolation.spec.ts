import { type AxisPosition, locate, mix } from './interpolation';

// Linear interpolation and bisection search: definitions (common practice, no outside source).
describe('locate and mix', () => {
  const axis = [0, 10, 20, 40];
  const at = (i: number) => axis[i];
  const position: AxisPosition = { index: -1, t: -1 };

  it('finds the segment and fraction of a value', () => {
    expect(locate(axis.length, at, 25, position)).toBe(true);
    expect(position).toEqual({ index: 2, t: 0.25 });
    expect(locate(axis.length, at, 40, position)).toBe(true);
    expect(position).toEqual({ index: 2, t: 1 });
    expect(locate(axis.length, at, 0, position)).toBe(true);
    expect(position).toEqual({ index: 0, t: 0 });
  });

  it('refuses values beyond the ends, and NaN', () => {
    expect(locate(axis.length, at, -0.001, position)).toBe(false);
    expect(locate(axis.length, at, 40.001, position)).toBe(false);
    expect(locate(axis.length, at, Number.NaN, position)).toBe(false);
  });

  it('mixes exactly at both ends', () => {
    expect(mix(0.1, 0.7, 0)).toBe(0.1);
    expect(mix(0.1, 0.7, 1)).toBe(0.7);
    expect(mix(10, 20, 0.25)).toBe(12.5);
  });
});
