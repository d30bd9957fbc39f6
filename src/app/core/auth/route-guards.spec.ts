import { TestBed } from '@angular/core/testing';
import { ActivatedRouteSnapshot, Router, RouterStateSnapshot, UrlTree, provideRouter } from '@angular/router';
import { Observable, firstValueFrom, of } from 'rxjs';
import { SessionUser } from '@shared/api/auth';
import { AuthService } from './auth-service';
import { capabilityGuard } from './capability-guard';
import { signedInGuard, signedOutGuard } from './signed-in-guard';

const pilot: SessionUser = {
  id: 3,
  email: 'pilot@demo.speedwright.example',
  displayName: 'Sam Hollis',
  role: 'pilot',
  operatorId: 1,
  operatorName: 'Kestrel Fen Aviation (demo)', operatorIsDemo: true,
};

describe('signedInGuard, signedOutGuard and capabilityGuard', () => {
  let session: SessionUser | null;

  beforeEach(() => {
    session = null;
    TestBed.configureTestingModule({
      providers: [provideRouter([]), { provide: AuthService, useValue: { session: () => of(session) } }],
    });
  });

  function run(guard: typeof signedInGuard, url: string): Promise<boolean | UrlTree> {
    const result = TestBed.runInInjectionContext(() =>
      guard({} as ActivatedRouteSnapshot, { url } as RouterStateSnapshot),
    ) as Observable<boolean | UrlTree>;
    return firstValueFrom(result);
  }

  function serialize(result: boolean | UrlTree): string | boolean {
    return result instanceof UrlTree ? TestBed.inject(Router).serializeUrl(result) : result;
  }

  it('signedInGuard sends a signed-out person to sign-in with the return URL', async () => {
    expect(serialize(await run(signedInGuard, '/people?x=1'))).toBe('/sign-in?returnUrl=%2Fpeople%3Fx%3D1');
  });

  it('signedInGuard lets a signed-in person through', async () => {
    session = pilot;
    expect(await run(signedInGuard, '/home')).toBe(true);
  });

  it('signedOutGuard sends a signed-in person home', async () => {
    session = pilot;
    expect(serialize(await run(signedOutGuard, '/sign-in'))).toBe('/home');
  });

  it('capabilityGuard refuses a pilot the people page and says why on the not-allowed page', async () => {
    session = pilot;
    expect(serialize(await run(capabilityGuard('manage-people'), '/people'))).toBe('/not-allowed?page=%2Fpeople');
  });

  it('capabilityGuard lets an admin manage people', async () => {
    session = { ...pilot, role: 'admin' };
    expect(await run(capabilityGuard('manage-people'), '/people')).toBe(true);
  });
});
