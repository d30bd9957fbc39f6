import { withSavedRecord } from './form-dialogs';

describe('withSavedRecord', () => {
  const list = [
    { id: 1, registration: 'ZZ-KFA' },
    { id: 2, registration: 'ZZ-KFB' },
  ] as const;

  it('puts a saved record in the place of the one with its id', () => {
    expect(withSavedRecord(list, { id: 2, registration: 'ZZ-KFX' })).toEqual([
      { id: 1, registration: 'ZZ-KFA' },
      { id: 2, registration: 'ZZ-KFX' },
    ]);
  });

  it('adds a new record at the end and leaves the list it was given alone', () => {
    expect(withSavedRecord(list, { id: 3, registration: 'ZZ-KFC' }).map((item) => item.id)).toEqual([1, 2, 3]);
    expect(list).toHaveLength(2);
  });
});
