import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Subject } from 'rxjs';
import { addressedRecord } from './addressed-record';

describe('addressedRecord', () => {
  it('loads the record the address names, again when the id changes and on reload', async () => {
    const id = signal(7);
    const asked: number[] = [];
    const record = TestBed.runInInjectionContext(() =>
      addressedRecord(id, (current) => {
        asked.push(current);
        const answer = new Subject<string>();
        queueMicrotask(() => answer.next(`record ${current}`));
        return answer;
      }, 'No record here.'),
    );
    TestBed.tick();
    await Promise.resolve();
    expect(record.value()).toBe('record 7');
    id.set(8);
    TestBed.tick();
    await Promise.resolve();
    expect(record.value()).toBe('record 8');
    record.reload();
    expect(asked).toEqual([7, 8, 8]);
  });

  it('asks nobody when the address gives no id, and says so', () => {
    const asked: number[] = [];
    const record = TestBed.runInInjectionContext(() =>
      addressedRecord(signal(Number.NaN), (current) => {
        asked.push(current);
        return new Subject<string>();
      }, 'This address does not name a revision.'),
    );
    TestBed.tick();
    expect(asked).toEqual([]);
    expect(record.problem()).toBe('This address does not name a revision.');
    expect(record.loading()).toBe(false);
  });
});
