import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import {
  InvitePersonRequest,
  OperatorPerson,
  UpdatePersonRequest,
  operatorPeopleSchema,
  operatorPersonResponseSchema,
} from '@shared/api/auth';
import { InvitationSent, invitationSentSchema } from '@shared/api/people';
import { API_PATHS } from '../core/api/api-paths';
import { ApiClient } from '../core/api/api-client';

/** The people of the signed-in admin's operator, as the server lists and changes them. */
@Injectable({ providedIn: 'root' })
export class OperatorPeople {
  private readonly api = inject(ApiClient);

  list(): Observable<OperatorPerson[]> {
    return this.api.get(API_PATHS.users, operatorPeopleSchema).pipe(map(({ users }) => users));
  }

  invite(request: InvitePersonRequest): Observable<InvitationSent> {
    return this.api.post(API_PATHS.users, request, invitationSentSchema);
  }

  change(id: number, change: UpdatePersonRequest): Observable<OperatorPerson> {
    return this.api.patch(`${API_PATHS.users}/${id}`, change, operatorPersonResponseSchema).pipe(map(({ user }) => user));
  }

  resendInvitation(id: number): Observable<InvitationSent> {
    return this.api.post(`${API_PATHS.users}/${id}/invitation`, {}, invitationSentSchema);
  }
}
