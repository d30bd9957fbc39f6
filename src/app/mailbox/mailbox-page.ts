import { DOCUMENT } from '@angular/common';
import { utcDateTime } from '../core/format/display-format';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MailboxMessage } from '@shared/api/mailbox';
import { requestState } from '../core/api/request-state';
import { DevMailbox } from './dev-mailbox';
import { MailTextPart, splitMailText } from './mail-text';
import { ProblemNote } from '../core/feedback/problem-note';

interface ShownMessage {
  readonly id: string;
  readonly subject: string;
  readonly to: string;
  readonly receivedLabel: string;
  readonly parts: readonly MailTextPart[];
}

/** Said when the server sends real mail: then there is no mailbox to show. */
export const NO_FAKE_MAILBOX =
  'This server sends real e-mail, so there is no development mailbox: invitations and password-reset links go to each person’s own inbox.';

/** The mails Speedwright sent while it runs with its local fake mail server, links clickable. */
@Component({
  selector: 'sw-mailbox-page',
  imports: [ProblemNote, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './mailbox-page.html',
  styleUrl: './mailbox-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MailboxPage {
  private readonly mailbox = inject(DevMailbox);
  private readonly origin = inject(DOCUMENT).location.origin;

  private readonly request = requestState();
  protected readonly loading = this.request.busy;
  protected readonly problem = this.request.problem;
  protected readonly messages = signal<readonly ShownMessage[]>([]);

  constructor() {
    this.loadMessages();
  }

  protected loadMessages(): void {
    if (this.loading()) return;
    this.request.run(
      this.mailbox.messages(),
      (messages) => this.messages.set(messages.map((message) => this.toShown(message))),
      (error) => (error.status === 404 ? NO_FAKE_MAILBOX : error.message),
    );
  }

  private toShown(message: MailboxMessage): ShownMessage {
    const received = Date.parse(message.receivedAt);
    return {
      id: message.id,
      subject: message.subject || '(no subject)',
      to: message.to.join(', '),
      receivedLabel: Number.isFinite(received) ? utcDateTime(message.receivedAt, { seconds: true }) : message.receivedAt,
      parts: splitMailText(message.text, message.links, this.origin),
    };
  }
}
