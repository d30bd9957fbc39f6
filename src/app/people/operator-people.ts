import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { OperatorPerson, operatorPeopleSchema } from '../../../shared/api/auth';
import { API_PATHS } from '../core/api/api-paths';
import { ApiClient } from '../core/api/api-client';

/** The people of the signed-in admin's operator, as the server lists them. */
@Injectable({ providedIn: 'root' })
export class OperatorPeople {
  private readonly api = inject(ApiClient);

  list(): Observable<OperatorPerson[]> {
    return this.api.get(API_PATHS.users, operatorPeopleSchema).pipe(map(({ users }) => users));
  }
}
