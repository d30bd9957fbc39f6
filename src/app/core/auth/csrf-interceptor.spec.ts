import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { API_PATHS, CSRF_HEADER } from '../api/api-paths';
import { csrfInterceptor } from './csrf-interceptor';
import { CsrfToken } from './csrf-token';

describe('csrfInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(withInterceptors([csrfInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  it('fetches the token and sends it on a POST to the API', () => {
    let answer: unknown;
    http.post('/api/things', { a: 1 }).subscribe((body) => (answer = body));

    backend.expectOne({ method: 'GET', url: API_PATHS.csrf }).flush({ token: 'tok-1' });
    const write = backend.expectOne({ method: 'POST', url: '/api/things' });
    expect(write.request.headers.get(CSRF_HEADER)).toBe('tok-1');
    write.flush({ ok: true });
    expect(answer).toEqual({ ok: true });
  });

  it.each(['PUT', 'PATCH', 'DELETE'])('sends the token on %s', (method) => {
    http.request(method, '/api/things/1', { body: {} }).subscribe();
    backend.expectOne(API_PATHS.csrf).flush({ token: 'tok-2' });
    expect(backend.expectOne('/api/things/1').request.headers.get(CSRF_HEADER)).toBe('tok-2');
  });

  it('leaves GET requests alone and fetches no token for them', () => {
    http.get('/api/users').subscribe();
    const read = backend.expectOne('/api/users');
    expect(read.request.headers.has(CSRF_HEADER)).toBe(false);
    backend.expectNone(API_PATHS.csrf);
    read.flush({});
  });

  it('never sends the token to another origin', () => {
    http.post('https://elsewhere.example/api/x', {}).subscribe();
    const write = backend.expectOne('https://elsewhere.example/api/x');
    expect(write.request.headers.has(CSRF_HEADER)).toBe(false);
    write.flush({});
  });

  it('reuses one token for several writes', () => {
    http.post('/api/a', {}).subscribe();
    http.post('/api/b', {}).subscribe();
    backend.expectOne(API_PATHS.csrf).flush({ token: 'shared' });
    expect(backend.expectOne('/api/a').request.headers.get(CSRF_HEADER)).toBe('shared');
    expect(backend.expectOne('/api/b').request.headers.get(CSRF_HEADER)).toBe('shared');
  });

  it('fetches a fresh token after forget()', () => {
    http.post('/api/a', {}).subscribe();
    backend.expectOne(API_PATHS.csrf).flush({ token: 'old' });
    backend.expectOne('/api/a').flush({});

    TestBed.inject(CsrfToken).forget();
    http.post('/api/b', {}).subscribe();
    backend.expectOne(API_PATHS.csrf).flush({ token: 'new' });
    expect(backend.expectOne('/api/b').request.headers.get(CSRF_HEADER)).toBe('new');
  });

  it('refetches the token once and retries when the server rejects it as stale', () => {
    let answer: unknown;
    http.post('/api/a', {}).subscribe((body) => (answer = body));
    backend.expectOne(API_PATHS.csrf).flush({ token: 'stale' });
    backend
      .expectOne('/api/a')
      .flush({ error: { code: 'csrf_invalid', message: 'Token expired.' } }, { status: 403, statusText: 'Forbidden' });

    backend.expectOne(API_PATHS.csrf).flush({ token: 'fresh' });
    const retry = backend.expectOne('/api/a');
    expect(retry.request.headers.get(CSRF_HEADER)).toBe('fresh');
    retry.flush({ ok: 1 });
    expect(answer).toEqual({ ok: 1 });
  });

  it('gives up after one retry', () => {
    let status = 0;
    http.post('/api/a', {}).subscribe({ error: (error) => (status = error.status) });
    const stale = { error: { code: 'csrf_invalid', message: 'Token expired.' } };
    backend.expectOne(API_PATHS.csrf).flush({ token: 'one' });
    backend.expectOne('/api/a').flush(stale, { status: 403, statusText: 'Forbidden' });
    backend.expectOne(API_PATHS.csrf).flush({ token: 'two' });
    backend.expectOne('/api/a').flush(stale, { status: 403, statusText: 'Forbidden' });
    expect(status).toBe(403);
  });

  it('does not retry a 403 for any other reason', () => {
    let status = 0;
    http.post('/api/a', {}).subscribe({ error: (error) => (status = error.status) });
    backend.expectOne(API_PATHS.csrf).flush({ token: 'one' });
    backend
      .expectOne('/api/a')
      .flush({ error: { code: 'forbidden', message: 'Your role may not do this.' } }, { status: 403, statusText: 'Forbidden' });
    expect(status).toBe(403);
  });
});
