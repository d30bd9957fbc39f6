import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { MailboxMessage, mailboxResponseSchema } from '@shared/api/mailbox';
import { API_PATHS } from '../core/api/api-paths';
import { ApiClient } from '../core/api/api-client';

/** What the server's local fake mail server received for the operator's people, newest first. */
@Injectable({ providedIn: 'root' })
export class DevMailbox {
  private readonly api = inject(ApiClient);

  messages(): Observable<MailboxMessage[]> {
    return this.api.get(API_PATHS.mailbox, mailboxResponseSchema).pipe(map(({ messages }) => messages));
  }
}
