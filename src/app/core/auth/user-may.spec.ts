import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import type { Role } from '@shared/auth/roles';
import { AuthService } from './auth-service';
import { userMay } from './user-may';

describe('userMay', () => {
  const user = signal<{ id: number; role: Role } | null>(null);

  beforeEach(() => {
    user.set(null);
    TestBed.configureTestingModule({ providers: [{ provide: AuthService, useValue: { user } }] });
  });

  it('follows the signed-in person and the role table', () => {
    const mayPublish = TestBed.runInInjectionContext(() => userMay('publish-revisions'));
    expect(mayPublish()).toBe(false);
    user.set({ id: 4, role: 'engineer' });
    expect(mayPublish()).toBe(false);
    user.set({ id: 5, role: 'approver' });
    expect(mayPublish()).toBe(true);
    user.set(null);
    expect(mayPublish()).toBe(false);
  });
});
