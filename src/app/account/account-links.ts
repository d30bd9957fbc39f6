import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { PasswordResetRequest, passwordSetResponseSchema } from '@shared/api/auth';
import type { AcceptInvitationRequest, ChangePasswordRequest, PasswordResetConfirm } from '@shared/api/new-password';
import { passwordResetRequestedSchema } from '@shared/api/account-links';
import { API_PATHS } from '../core/api/api-paths';
import { ApiClient } from '../core/api/api-client';

/** The account links people get by mail; nobody is signed in for these. */
@Injectable({ providedIn: 'root' })
export class AccountLinks {
  private readonly api = inject(ApiClient);

  acceptInvitation(request: AcceptInvitationRequest): Observable<{ email: string }> {
    return this.api.post(API_PATHS.acceptInvitation, request, passwordSetResponseSchema);
  }

  confirmPasswordReset(request: PasswordResetConfirm): Observable<{ email: string }> {
    return this.api.post(API_PATHS.passwordResetConfirm, request, passwordSetResponseSchema);
  }

  /** Changes the signed-in person's password; their other sessions end. */
  changePassword(request: ChangePasswordRequest): Observable<void> {
    return this.api.postWithoutAnswer(API_PATHS.changePassword, request);
  }

  /** Lifts the sign-in wait with the token of the mailed link; answers the address to sign in with. */
  unlockSignIn(token: string): Observable<{ email: string }> {
    return this.api.post(API_PATHS.unlock, { token }, passwordSetResponseSchema);
  }

  /** Answers the server's sentence, which is the same whether or not the account exists. */
  requestPasswordReset(request: PasswordResetRequest): Observable<string> {
    return this.api.post(API_PATHS.passwordReset, request, passwordResetRequestedSchema).pipe(map(({ message }) => message));
  }
}
