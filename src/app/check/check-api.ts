import { Injectable, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { VERIFY_PATHS, verifyResponseSchema, verifySourceResponseSchema, type VerifyResponse, type VerifySource } from '@shared/card-check/verify-api';
import { ApiClient } from '../core/api/api-client';

/** The public card check calls (no sign-in, no CSRF: both are GETs). */
@Injectable({ providedIn: 'root' })
export class CheckApi {
  private readonly api = inject(ApiClient);

  /** `GET /api/verify/:code`: the status of the card with this code. */
  verify(code: string): Promise<VerifyResponse> {
    return firstValueFrom(this.api.get(VERIFY_PATHS.verify(code), verifyResponseSchema));
  }

  /** `GET /api/verify/:code/source`: what the card was built from (404 for an unknown code). */
  source(code: string): Promise<VerifySource> {
    return firstValueFrom(this.api.get(VERIFY_PATHS.source(code), verifySourceResponseSchema));
  }
}
