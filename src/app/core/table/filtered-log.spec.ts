import { TestBed } from '@angular/core/testing';
import { FormControl, FormGroup } from '@angular/forms';
import { Subject } from 'rxjs';
import { DAY_ORDER_PROBLEM, type UtcInstantRange } from './utc-day-range';
import { FILTER_PAUSE_MS, FilteredLog } from './filtered-log';

interface Page {
  readonly nextCursor: string | null;
  readonly items: readonly string[];
}

describe('FilteredLog', () => {
  afterEach(() => jest.useRealTimers());

  function setUp() {
    const form = new FormGroup({ who: new FormControl('', { nonNullable: true }), from: new FormControl('', { nonNullable: true }), to: new FormControl('', { nonNullable: true }) });
    const asked: { filter: UtcInstantRange & { who?: string }; cursor: string | null; answer: Subject<Page> }[] = [];
    const shown: string[][] = [];
    const log = TestBed.runInInjectionContext(
      () =>
        new FilteredLog<UtcInstantRange & { who?: string }, Page>({
          form,
          days: () => form.getRawValue(),
          filterOf: (days) => ({ who: form.controls.who.value || undefined, ...days }),
          page: (filter, cursor) => {
            const answer = new Subject<Page>();
            asked.push({ filter, cursor, answer });
            return answer;
          },
          show: (page) => shown.push([...page.items]),
        }),
    );
    return { form, asked, shown, log };
  }

  it('asks for the newest page, follows the server cursor, and shows only the newest request’s answer', () => {
    const { asked, shown, log } = setUp();
    log.pages.first();
    log.pages.first();
    asked[0]!.answer.next({ nextCursor: 'c2', items: ['stale'] });
    asked[1]!.answer.next({ nextCursor: 'c2', items: ['newest'] });
    expect(shown).toEqual([['newest']]);
    expect(log.pages.hasOlder()).toBe(true);
    log.pages.older();
    expect(asked[2]!.cursor).toBe('c2');
  });

  it('says the days contradict instead of asking, and asks again from the newest page once the filter pauses', () => {
    jest.useFakeTimers();
    const { form, asked, log } = setUp();
    form.setValue({ who: '', from: '2026-12-02', to: '2026-12-01' });
    jest.advanceTimersByTime(FILTER_PAUSE_MS);
    expect(log.filterProblem()).toBe(DAY_ORDER_PROBLEM);
    expect(asked).toHaveLength(0);
    form.setValue({ who: 'pilot', from: '', to: '' });
    jest.advanceTimersByTime(FILTER_PAUSE_MS - 1);
    expect(asked).toHaveLength(0);
    jest.advanceTimersByTime(1);
    expect(log.filterProblem()).toBeNull();
    expect(asked.map((request) => [request.filter.who, request.cursor])).toEqual([['pilot', null]]);
  });
});
