import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Observable } from 'rxjs';
import { OperatorPerson } from '@shared/api/auth';
import { InvitationSent } from '@shared/api/people';
import { ApiRequestError } from '../core/api/api-request-error';
import { requestState } from '../core/api/request-state';
import { ListSort } from '../core/table/list-sort';
import { ListTableState } from '../core/table/list-table-state';
import { ListTable } from '../core/table/list-table';
import { AuthService } from '../core/auth/auth-service';
import { ChangePersonDialog } from './change-person-dialog';
import { InvitePersonDialog } from './invite-person-dialog';
import { OperatorPeople } from './operator-people';
import { PersonRow, toPersonRow } from './person-row';
import { ProblemRetry } from '../core/feedback/problem-retry';
import { formDialogs, withSavedRecord } from '../core/forms/form-dialogs';

/**
 * The admin's list of the operator's people: who they are, their role, and their account;
 * and the admin's actions on them — invite, change role, lock, send an invitation again.
 */
@Component({
  selector: 'sw-people-page',
  imports: [ProblemRetry, MatTableModule, MatSortModule, ListSort, ListTable, MatButtonModule, MatIconModule, MatMenuModule, MatProgressBarModule],
  templateUrl: './people-page.html',
  styleUrl: './people-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeoplePage {
  private readonly people = inject(OperatorPeople);
  private readonly destroyRef = inject(DestroyRef);
  private readonly dialogs = formDialogs();
  private readonly auth = inject(AuthService);

  protected readonly columns: readonly string[] = ['displayName', 'roleLabel', 'accountLabel', 'lastSignIn', 'actions'];
  private readonly request = requestState();
  protected readonly loading = this.request.busy;
  protected readonly problem = this.request.problem;
  /** Why the last action on a person was refused; stays until dismissed or the next action. */
  protected readonly refusal = signal<string | null>(null);
  protected readonly signedInId = computed(() => this.auth.user()?.id ?? null);
  private readonly everyone = signal<readonly OperatorPerson[]>([]);
  private readonly allRows = computed(() => this.everyone().map(toPersonRow));

  protected readonly table = new ListTableState(this.allRows, { active: 'displayName', direction: 'asc' });
  protected readonly countSentence = computed(() => {
    const shown = this.table.matching().length;
    const total = this.table.total();
    const noun = total === 1 ? 'person' : 'people';
    return shown === total ? `${total} ${noun}` : `Showing ${shown} of ${total} ${noun}`;
  });

  constructor() {
    this.loadPeople();
  }

  protected loadPeople(): void {
    this.request.run(this.people.list(), (people) => this.everyone.set(people));
  }

  protected invitePerson(): void {
    this.refusal.set(null);
    this.dialogs.open(InvitePersonDialog, undefined, (sent: InvitationSent) => this.reportInvitation(sent, 'added'));
  }

  protected changePerson(row: PersonRow): void {
    const person = this.personOf(row);
    if (!person) return;
    this.refusal.set(null);
    this.dialogs.open(ChangePersonDialog, person, (saved: OperatorPerson) => {
      this.keep(saved);
      this.dialogs.note(`${saved.displayName} is saved.`);
    });
  }

  protected lockPerson(row: PersonRow): void {
    this.act(this.people.change(row.id, { locked: true }), (saved) => {
      this.keep(saved);
      return `${saved.displayName} is locked out and signed out of every device.`;
    });
  }

  protected unlockPerson(row: PersonRow): void {
    this.act(this.people.change(row.id, { locked: false }), (saved) => {
      this.keep(saved);
      return `${saved.displayName} may sign in again.`;
    });
  }

  protected resendInvitation(row: PersonRow): void {
    this.act(this.people.resendInvitation(row.id), (sent) => this.reportInvitation(sent, 'resent'));
  }

  protected dismissRefusal(): void {
    this.refusal.set(null);
  }

  private act<T>(request: Observable<T>, succeeded: (answer: T) => string | null): void {
    this.refusal.set(null);
    request.pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (answer) => {
        const sentence = succeeded(answer);
        if (sentence) this.dialogs.note(sentence);
      },
      error: (error: ApiRequestError) => this.refusal.set(error.message),
    });
  }

  /** A mail that did not go out is worth more than a passing note. */
  private reportInvitation(sent: InvitationSent, how: 'added' | 'resent'): null {
    this.keep(sent.user);
    if (!sent.mailSent) {
      this.refusal.set(
        `${sent.user.displayName} is ${how === 'added' ? 'added' : 'given a new link'}, but the mail server did not take the invitation. Try “Send the invitation again” later.`,
      );
      return null;
    }
    this.dialogs.note(`An invitation is on its way to ${sent.user.email}.`);
    return null;
  }

  private personOf(row: PersonRow): OperatorPerson | undefined {
    return this.everyone().find((person) => person.id === row.id);
  }

  private keep(saved: OperatorPerson): void {
    this.everyone.update((list) => withSavedRecord(list, saved));
  }
}
