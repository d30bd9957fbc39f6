import { CursorPages } from './cursor-pages';
import { DAY_ORDER_PROBLEM, utcDayRange } from './utc-day-range';

describe('CursorPages', () => {
  function pagesAnswering(nextOf: Record<string, string | null>) {
    const asked: (string | null)[] = [];
    const pages: CursorPages = new CursorPages((cursor) => {
      asked.push(cursor);
      pages.arrived(cursor, nextOf[String(cursor)] ?? null);
    });
    return { pages, asked };
  }

  it('walks older with the cursor the server named and back newer along the same cursors', () => {
    const { pages, asked } = pagesAnswering({ null: '40', '40': '20', '20': null });
    pages.first();
    expect(pages.pageNumber()).toBe(1);
    expect(pages.hasNewer()).toBe(false);
    pages.older();
    pages.older();
    expect(pages.pageNumber()).toBe(3);
    expect(pages.hasOlder()).toBe(false);
    pages.older(); // nothing older: no request
    pages.newer();
    expect(pages.pageNumber()).toBe(2);
    pages.reload();
    expect(asked).toEqual([null, '40', '20', '40', '40']);
  });

  it('starts over at the newest page and forgets the way back', () => {
    const { pages, asked } = pagesAnswering({ null: '40', '40': '20' });
    pages.first();
    pages.older();
    pages.first();
    expect(pages.pageNumber()).toBe(1);
    pages.newer(); // already the newest: no request
    expect(asked).toEqual([null, '40', null]);
  });
});

describe('utcDayRange', () => {
  it('turns calendar days into UTC instants with the "to" day included', () => {
    expect(utcDayRange('2026-11-29', '2026-11-30')).toEqual({ from: '2026-11-29T00:00:00.000Z', to: '2026-11-30T23:59:59.999Z' });
    expect(utcDayRange('', '')).toEqual({ from: undefined, to: undefined });
    expect(utcDayRange('2026-11-30', '2026-11-30')).toEqual({ from: '2026-11-30T00:00:00.000Z', to: '2026-11-30T23:59:59.999Z' });
  });

  it('refuses a "from" day after the "to" day', () => {
    expect(utcDayRange('2026-12-01', '2026-11-30')).toBeNull();
    expect(DAY_ORDER_PROBLEM).toBe('The “from” date is after the “to” date. Change one of them.');
  });
});
