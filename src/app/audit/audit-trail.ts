import { HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import * as z from 'zod';
import { AuditQuery, auditPageSchema } from '@shared/api/audit';
import { API_PATHS } from '../core/api/api-paths';
import { ApiClient } from '../core/api/api-client';

export type AuditPage = z.infer<typeof auditPageSchema>;
/** The filter as the page holds it; `limit` and `cursor` are the page's business. */
export type AuditFilter = Omit<Partial<AuditQuery>, 'limit' | 'cursor'>;

/** The operator's audit trail, newest first, one page at a time. */
@Injectable({ providedIn: 'root' })
export class AuditTrail {
  private readonly api = inject(ApiClient);

  page(filter: AuditFilter, limit: number, cursor: string | null): Observable<AuditPage> {
    let params = new HttpParams().set('limit', String(limit));
    for (const [key, value] of Object.entries(filter)) {
      if (value) params = params.set(key, String(value));
    }
    if (cursor) params = params.set('cursor', cursor);
    return this.api.get(`${API_PATHS.audit}?${params.toString()}`, auditPageSchema);
  }
}
