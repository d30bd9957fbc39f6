import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { unlockRequestSchema } from '@shared/api/auth';
import { requestState } from '../core/api/request-state';
import { AccountFrame } from './account-frame';
import { AccountLinks } from './account-links';
import { readLinkToken } from './link-token';
import { ProblemNote } from '../core/feedback/problem-note';

/**
 * The link of the "wrong passwords were typed" mail: one button lifts the wait, so a person on
 * a new device need not sit out the back-off someone else caused. A button rather than on
 * load, so a mail scanner that opens links changes nothing.
 */
@Component({
  selector: 'sw-unlock-page',
  imports: [ProblemNote, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, AccountFrame],
  templateUrl: './unlock-page.html',
  styleUrl: './account-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UnlockPage {
  private readonly links = inject(AccountLinks);
  private readonly route = inject(ActivatedRoute);

  private readonly link = readLinkToken(this.route.snapshot.fragment, this.route.snapshot.queryParamMap.get('token'), unlockRequestSchema.shape.token);
  protected readonly linkProblem = signal('problem' in this.link ? this.link.problem : null);
  private readonly request = requestState();
  protected readonly pending = this.request.busy;
  protected readonly doneFor = signal<string | null>(null);

  protected liftWait(): void {
    if (this.pending() || !('token' in this.link)) return;
    this.request.run(
      this.links.unlockSignIn(this.link.token),
      ({ email }) => this.doneFor.set(email),
      (error) => {
        this.linkProblem.set(error.message);
        return null;
      },
    );
  }
}
