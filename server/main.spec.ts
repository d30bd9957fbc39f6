import { webConcurrency } from './main';

// WEB_CONCURRENCY as an operator writes it: unset or empty means one process; anything else
// must be a whole number of processes, or the server refuses to start with a sentence.
describe('WEB_CONCURRENCY', () => {
  it('defaults to one process and takes a whole number from 1 to 64', () => {
    expect(webConcurrency(undefined)).toBe(1);
    expect(webConcurrency('')).toBe(1);
    expect(webConcurrency('2')).toBe(2);
    expect(webConcurrency('64')).toBe(64);
  });

  it('refuses anything else with the value named', () => {
    for (const bad of ['0', '65', '1.5', 'two', '-1']) {
      expect(() => webConcurrency(bad)).toThrow(`WEB_CONCURRENCY must be a whole number from 1 to 64, not "${bad}".`);
    }
  });
});
