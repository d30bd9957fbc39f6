import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Observable } from 'rxjs';
import { OperatorPerson } from '../../../shared/api/auth';
import { InvitationSent } from '../../../shared/api/people';
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
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
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
    this.dialog
      .open<InvitePersonDialog, void, InvitationSent>(InvitePersonDialog, { autoFocus: 'first-tabbable' })
      .afterClosed()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe((sent) => sent && this.reportInvitation(sent, 'added'));
  }

  protected changePerson(row: PersonRow): void {
    const person = this.personOf(row);
    if (!person) return;
    this.refusal.set(null);
    this.dialog
      .open<ChangePersonDialog, OperatorPerson, OperatorPerson>(ChangePersonDialog, { data: person, autoFocus: 'first-tabbable' })
      .afterClosed()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe((saved) => {
        if (!saved) return;
        this.keep(saved);
        this.snackBar.open(`${saved.displayName} is saved.`, 'Close', { duration: 5000 });
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
        if (sentence) this.snackBar.open(sentence, 'Close', { duration: 5000 });
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
    this.snackBar.open(`An invitation is on its way to ${sent.user.email}.`, 'Close', { duration: 5000 });
    return null;
  }

  private personOf(row: PersonRow): OperatorPerson | undefined {
    return this.everyone().find((person) => person.id === row.id);
  }

  private keep(saved: OperatorPerson): void {
    this.everyone.update((list) =>
      list.some((person) => person.id === saved.id) ? list.map((person) => (person.id === saved.id ? saved : person)) : [...list, saved],
    );
  }
}
