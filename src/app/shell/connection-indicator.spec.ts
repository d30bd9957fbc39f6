import { TestBed } from '@angular/core/testing';
import { ConnectionIndicator } from './connection-indicator';

describe('ConnectionIndicator', () => {
  afterEach(() => {
    window.dispatchEvent(new Event('online'));
  });

  it('follows the browser online and offline events, in words', async () => {
    const fixture = TestBed.configureTestingModule({ imports: [ConnectionIndicator] }).createComponent(ConnectionIndicator);
    await fixture.whenStable();
    const host = fixture.nativeElement as HTMLElement;
    const text = () => host.querySelector('[data-testid="connection-status"]')?.textContent?.trim();
    expect(host.getAttribute('role')).toBe('status');
    expect(text()).toBe('Online');

    window.dispatchEvent(new Event('offline'));
    await fixture.whenStable();
    expect(text()).toBe('Offline');
    expect(host.classList.contains('offline')).toBe(true);

    window.dispatchEvent(new Event('online'));
    await fixture.whenStable();
    expect(text()).toBe('Online');
    expect(host.classList.contains('offline')).toBe(false);
  });

  it('starts from navigator.onLine', async () => {
    const onLine = jest.spyOn(window.navigator, 'onLine', 'get').mockReturnValue(false);
    const fixture = TestBed.configureTestingModule({ imports: [ConnectionIndicator] }).createComponent(ConnectionIndicator);
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('[data-testid="connection-status"]').textContent.trim()).toBe('Offline');
    onLine.mockRestore();
  });
});
