import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MailboxMessage } from '@shared/api/mailbox';
import { API_PATHS } from '../core/api/api-paths';
import { MailboxPage, NO_FAKE_MAILBOX } from './mailbox-page';

const here = window.location.origin;
const invitation: MailboxMessage = {
  id: '2026-12-01T10-00-00-000Z-1a2b3c4d',
  from: 'Speedwright <no-reply@speedwright.localhost>',
  to: ['lee@demo.speedwright.example'],
  subject: 'You are invited to Kestrel Fen Aviation (demo) on Speedwright',
  receivedAt: '2026-12-01T10:00:00.000Z',
  text: 'Hello Lee,\n\nTo choose your password and start, open this link:\nhttp://localhost:4300/invitation#token=abc\n\nThe link works once.',
  links: ['http://localhost:4300/invitation#token=abc'],
};

describe('MailboxPage', () => {
  let fixture: ComponentFixture<MailboxPage>;
  let backend: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [MailboxPage], providers: [provideHttpClient(), provideHttpClientTesting()] });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(MailboxPage);
    page = fixture.nativeElement;
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  async function answer(body: unknown, status = 200): Promise<void> {
    backend.expectOne(API_PATHS.mailbox).flush(body, { status, statusText: 'x' });
    await fixture.whenStable();
  }

  it('shows each mail with its subject, recipient, time and text, the link clickable at this address', async () => {
    await answer({ messages: [invitation] });
    const mail = page.querySelector('[data-testid="mail"]') as HTMLElement;
    expect(mail.querySelector('h2')?.textContent?.trim()).toBe(invitation.subject);
    expect(mail.querySelector('.meta')?.textContent?.trim()).toBe('To lee@demo.speedwright.example · 1 Dec 2026, 10:00:00 UTC');
    expect(mail.querySelector('.text')?.textContent).toBe(invitation.text);
    const link = mail.querySelector('a') as HTMLAnchorElement;
    expect(link.textContent).toBe('http://localhost:4300/invitation#token=abc');
    expect(link.getAttribute('href')).toBe(here === 'http://localhost:4300' ? invitation.links[0] : `${here}/invitation#token=abc`);
    expect(link.target).toBe('_blank');
  });

  it('says there is no mail yet, and checks again on request', async () => {
    await answer({ messages: [] });
    expect(page.querySelector('[data-testid="mailbox-empty"]')?.textContent).toContain('No mail yet.');
    Array.from(page.querySelectorAll('button')).find((b) => b.textContent?.includes('Check for new mail'))!.click();
    await fixture.whenStable();
    await answer({ messages: [invitation] });
    expect(page.querySelectorAll('[data-testid="mail"]')).toHaveLength(1);
  });

  it('explains that a server sending real mail has no mailbox', async () => {
    await answer({ error: { code: 'no_such_route', message: 'There is no GET /api/dev/mailbox in this API.' } }, 404);
    expect(page.querySelector('[data-testid="mailbox-error"]')?.textContent?.trim()).toBe(NO_FAKE_MAILBOX);
  });
});
