/**
 * Who may call what: every route of fleet, speed books, revisions, signing key, audit and the
 * API description, called by every role of the demo operator, by the second operator's pilot
 * and administrator, and signed out. Each call gets a fresh record in the state the route
 * needs, so an allowed call succeeds and a refused one is refused for its role alone.
 */
import { randomBytes } from 'node:crypto';
import type { Role } from '@shared/auth/roles';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import { csrfAgent, startHarness, TEST_SIGNING_KEY_SECRET, type Harness } from '../../test/api/harness';
import type { Actor } from '../audit/actor';
import { createAircraftType, createAirframe } from '../fleet/fleet.service';
import { Operator, User } from '../models';
import { approveRevision, createRevision, submitRevision } from '../revisions/revisions.service';
import { createSpeedBook } from './speed-books.service';
import { signInEveryone, type Session, type SessionsByRole } from '../../test/api/test-helpers';

// Every step hashes or checks passwords or signs; on a busy two-core machine 5 s is short.
jest.setTimeout(30_000);

let harness: Harness;
let as: SessionsByRole;
let signedOut: Session;
const actors = {} as Record<'admin' | 'engineer' | 'approver', Actor>;

beforeAll(async () => {
  harness = startHarness();
  as = await signInEveryone(harness.app);
  signedOut = await csrfAgent(harness.app);
  const operator = await Operator.findOne({ where: { slug: 'kestrel-fen' }, rejectOnEmpty: true });
  for (const role of ['admin', 'engineer', 'approver'] as const) {
    const user = await User.findOne({ where: { email: `${role}@demo.speedwright.example` }, rejectOnEmpty: true });
    actors[role] = { operatorId: operator.id, userId: user.id, role };
  }
}, 60_000);
afterAll(() => harness.close());

const tag = () => randomBytes(3).toString('hex').toUpperCase();

/** Records of the demo operator in the state each route needs. */
const fixtures = {
  none: async () => ({}),
  type: async () => ({ id: (await createAircraftType(actors.admin, { designator: `A${tag()}`, name: 'Access test type', category: 'piston-single', engines: 1, ceilingFt: 14000 })).id }),
  airframe: async () => {
    const type = await fixtures.type();
    return { id: (await createAirframe(actors.admin, { registration: `ZZ-${tag().slice(0, 5)}`, serial: 'S1', aircraftTypeId: type.id, active: true })).id, typeId: type.id };
  },
  book: async () => {
    const type = await fixtures.type();
    return { id: (await createSpeedBook(actors.engineer, { aircraftTypeId: type.id, title: 'Access test book' })).id };
  },
  draft: async () => {
    const book = await fixtures.book();
    return { id: (await createRevision(actors.engineer, book.id, { content: demoPistonTrainerContent(), changeSummary: 'Access test' })).id };
  },
  review: async () => {
    const draft = await fixtures.draft();
    await submitRevision(actors.engineer, draft.id);
    return draft;
  },
  published: async () => {
    const review = await fixtures.review();
    await approveRevision(actors.approver, review.id, TEST_SIGNING_KEY_SECRET);
    return review;
  },
};

type Fixture = keyof typeof fixtures;
type Caller = Role | 'secondPilot' | 'secondAdmin' | 'signedOut';
const DEMO_ROLES: Role[] = ['pilot', 'engineer', 'approver', 'admin', 'inspector'];
const CALLERS: Caller[] = [...DEMO_ROLES, 'secondPilot', 'secondAdmin', 'signedOut'];
const SECOND_ROLES: Record<'secondPilot' | 'secondAdmin', Role> = { secondPilot: 'pilot', secondAdmin: 'admin' };

interface RouteCase {
  method: 'get' | 'post' | 'patch';
  path: string;
  fixture: Fixture;
  url: (record: { id?: number; typeId?: number }) => string;
  body?: (record: { id?: number; typeId?: number }) => object;
  /** Roles that may; they get `ok`. Others get 403, or `refused` when given. */
  may: Role[] | 'public';
  ok: number;
  refused?: number;
  /** What the second operator's people get when their role may: 404 for another's record, or this. */
  otherOperator?: number;
}

const ALL: Role[] = DEMO_ROLES;
const EDIT: Role[] = ['engineer', 'approver'];
const APPROVE: Role[] = ['approver'];

const ROUTES: RouteCase[] = [
  { method: 'get', path: '/api/aircraft-types', fixture: 'none', url: () => '/api/aircraft-types', may: ALL, ok: 200, otherOperator: 200 },
  { method: 'get', path: '/api/aircraft-types/:id', fixture: 'type', url: (r) => `/api/aircraft-types/${r.id}`, may: ALL, ok: 200 },
  {
    method: 'post', path: '/api/aircraft-types', fixture: 'none', url: () => '/api/aircraft-types',
    body: () => ({ designator: `B${tag()}`, name: 'Made in the access test', category: 'jet', engines: 2, ceilingFt: 41000 }), may: ['admin'], ok: 201, otherOperator: 201,
  },
  { method: 'patch', path: '/api/aircraft-types/:id', fixture: 'type', url: (r) => `/api/aircraft-types/${r.id}`, body: () => ({ name: 'Renamed' }), may: ['admin'], ok: 200 },
  { method: 'get', path: '/api/airframes', fixture: 'none', url: () => '/api/airframes', may: ALL, ok: 200, otherOperator: 200 },
  { method: 'get', path: '/api/airframes/:id', fixture: 'airframe', url: (r) => `/api/airframes/${r.id}`, may: ALL, ok: 200 },
  {
    method: 'post', path: '/api/airframes', fixture: 'type', url: () => '/api/airframes',
    // The type is the demo operator's: for the second operator's admin it is no type at all.
    body: (r) => ({ registration: `ZZ-${tag().slice(0, 5)}`, serial: 'S2', aircraftTypeId: r.id }), may: ['admin'], ok: 201, otherOperator: 422,
  },
  { method: 'patch', path: '/api/airframes/:id', fixture: 'airframe', url: (r) => `/api/airframes/${r.id}`, body: () => ({ active: false }), may: ['admin'], ok: 200 },
  { method: 'get', path: '/api/speed-books', fixture: 'none', url: () => '/api/speed-books', may: ALL, ok: 200, otherOperator: 200 },
  { method: 'post', path: '/api/speed-books', fixture: 'type', url: () => '/api/speed-books', body: (r) => ({ aircraftTypeId: r.id, title: 'Access book' }), may: EDIT, ok: 201 },
  { method: 'get', path: '/api/speed-books/:id', fixture: 'book', url: (r) => `/api/speed-books/${r.id}`, may: ALL, ok: 200 },
  {
    method: 'post', path: '/api/speed-books/:id/revisions', fixture: 'book', url: (r) => `/api/speed-books/${r.id}/revisions`,
    body: () => ({ content: demoPistonTrainerContent(), changeSummary: 'Access' }), may: EDIT, ok: 201,
  },
  { method: 'get', path: '/api/revisions/:id', fixture: 'published', url: (r) => `/api/revisions/${r.id}`, may: ALL, ok: 200 },
  // A draft is hidden, not forbidden, from those who may not edit: it answers as if it did not exist.
  { method: 'get', path: '/api/revisions/:id (a draft)', fixture: 'draft', url: (r) => `/api/revisions/${r.id}`, may: EDIT, ok: 200, refused: 404 },
  { method: 'patch', path: '/api/revisions/:id', fixture: 'draft', url: (r) => `/api/revisions/${r.id}`, body: () => ({ changeSummary: 'Edited' }), may: EDIT, ok: 200 },
  { method: 'post', path: '/api/revisions/:id/submit', fixture: 'draft', url: (r) => `/api/revisions/${r.id}/submit`, may: EDIT, ok: 200 },
  { method: 'post', path: '/api/revisions/:id/approve', fixture: 'review', url: (r) => `/api/revisions/${r.id}/approve`, may: APPROVE, ok: 200 },
  { method: 'post', path: '/api/revisions/:id/return', fixture: 'review', url: (r) => `/api/revisions/${r.id}/return`, body: () => ({ reason: 'Check VA' }), may: APPROVE, ok: 200 },
  { method: 'post', path: '/api/revisions/:id/withdraw', fixture: 'published', url: (r) => `/api/revisions/${r.id}/withdraw`, body: () => ({ reason: 'Query' }), may: APPROVE, ok: 200 },
  { method: 'get', path: '/api/revisions/:id/diff', fixture: 'published', url: (r) => `/api/revisions/${r.id}/diff?against=${r.id}`, may: ALL, ok: 200 },
  { method: 'get', path: '/api/operator/signing-key', fixture: 'none', url: () => '/api/operator/signing-key', may: ALL, ok: 200, otherOperator: 200 },
  { method: 'get', path: '/api/audit', fixture: 'none', url: () => '/api/audit', may: ['admin', 'approver', 'inspector'], ok: 200, otherOperator: 200 },
  { method: 'get', path: '/api/openapi.json', fixture: 'none', url: () => '/api/openapi.json', may: 'public', ok: 200 },
];

function expected(route: RouteCase, caller: Caller): number {
  if (route.may === 'public') return route.ok;
  if (caller === 'signedOut') return 401;
  const role = caller === 'secondPilot' || caller === 'secondAdmin' ? SECOND_ROLES[caller] : caller;
  const may = route.may.includes(role);
  if (!may) return route.refused ?? 403;
  if (caller === 'secondPilot' || caller === 'secondAdmin') return route.otherOperator ?? 404;
  return route.ok;
}

function session(caller: Caller): Session {
  return caller === 'signedOut' ? signedOut : as[caller];
}

describe.each(ROUTES)('$method $path', (route) => {
  it('answers each caller as its role and operator allow', async () => {
    const got: Record<string, number> = {};
    const want: Record<string, number> = {};
    for (const caller of CALLERS) {
      const record = await fixtures[route.fixture]();
      const who = session(caller);
      let call = who.agent[route.method](route.url(record));
      if (route.method !== 'get') call = call.set('x-csrf-token', who.token).send(route.body?.(record) ?? {});
      const res = await call;
      got[caller] = res.status;
      want[caller] = expected(route, caller);
      if (res.status >= 400) expect(res.body.error?.code).toEqual(expect.any(String));
    }
    expect(got).toEqual(want);
  }, 60_000);
});
