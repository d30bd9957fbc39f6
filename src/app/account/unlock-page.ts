import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { finalize } from 'rxjs';
import { unlockRequestSchema } from '../../../shared/api/auth';
import { ApiRequestError } from '../core/api/api-request-error';
import { AccountLinks } from './account-links';
import { readLinkToken } from './link-token';

/**
 * The link of the "wrong passwords were typed" mail: one button lifts the wait, so a person on
 * a new device need not sit out the back-off someone else caused. A button rather than on
 * load, so a mail scanner that opens links changes nothing.
 */
@Component({
  selector: 'sw-unlock-page',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './unlock-page.html',
  styleUrl: './account-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UnlockPage {
  private readonly links = inject(AccountLinks);
  private readonly destroyRef = inject(DestroyRef);
  private readonly route = inject(ActivatedRoute);

  private readonly link = readLinkToken(this.route.snapshot.fragment, this.route.snapshot.queryParamMap.get('token'), unlockRequestSchema.shape.token);
  protected readonly linkProblem = signal('problem' in this.link ? this.link.problem : null);
  protected readonly pending = signal(false);
  protected readonly doneFor = signal<string | null>(null);

  protected liftWait(): void {
    if (this.pending() || !('token' in this.link)) return;
    this.pending.set(true);
    this.links
      .unlockSignIn(this.link.token)
      .pipe(
        finalize(() => this.pending.set(false)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: ({ email }) => this.doneFor.set(email),
        error: (error: ApiRequestError) => this.linkProblem.set(error.message),
      });
  }
}
