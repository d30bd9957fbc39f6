/**
 * The route × role × operator access matrix (issue 12). Every route the Express app registers
 * is found by walking its routers (test/api/app-routes.ts), so a new route cannot escape: it
 * fails here until it has its line in ACCESS. Each route is called signed out, by every role of
 * an operator of its own, and — for routes that name a record — with the id of a record of
 * another operator. The roles table (`shared/auth/roles.ts`, `can`) says what each role should get:
 *
 * - signed out: 401, unless the route is public;
 * - a role without the capability: 403 `forbidden`;
 * - a role with it: anything but 401/403/5xx (records that do not exist: the route's own answer);
 * - another operator's record: exactly the answer (status and code) for an id that does not exist.
 *
 * Calls carry an empty body, so no call with a role that may write changes anything; the files
 * beside this one (`server/speed-books/access.routes.spec.ts`, `server/users/people.routes.spec.ts`)
 * call the same routes with valid bodies.
 */
import { randomBytes, randomUUID } from 'node:crypto';
import type TestAgent from 'supertest/lib/agent';
import { can, ROLES, type Capability, type Role } from '@shared/auth/roles';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import { appRoutes } from '../test/api/app-routes';
import { csrfAgent, startHarness, type Harness } from '../test/api/harness';
import { createAircraftType, createAirframe } from './fleet/fleet.service';
import { Attachment, CardIssue } from './models';
import { createRevision } from './revisions/revisions.service';
import { createSpeedBook } from './speed-books/speed-books.service';
import { newTeam } from '../test/api/test-helpers';

jest.setTimeout(120_000);

type Rule = 'public' | 'signed-in' | Capability | readonly Capability[];

/** What each route needs, as the roles table names it. A new route: add its line. */
const ACCESS: Record<string, Rule> = {
  'GET /api/health': 'public',
  'GET /api/health/live': 'public',
  'GET /api/health/ready': 'public',
  'GET /api/openapi.json': 'public',
  'GET /api/auth/csrf': 'public',
  'POST /api/auth/login': 'public',
  'POST /api/auth/logout': 'public',
  'POST /api/auth/invitations/accept': 'public',
  'POST /api/auth/password-reset': 'public',
  'POST /api/auth/password-reset/confirm': 'public',
  'POST /api/auth/unlock': 'public',
  'GET /api/verify/:code': 'public',
  'GET /api/verify/:code/source': 'public',
  'GET /api/auth/me': 'signed-in',
  'POST /api/auth/password': 'signed-in',
  'GET /api/users': 'manage-people',
  'POST /api/users': 'manage-people',
  'PATCH /api/users/:id': 'manage-people',
  'POST /api/users/:id/invitation': 'manage-people',
  'GET /api/dev/mailbox': 'manage-people',
  'GET /api/operator/settings': 'manage-people',
  'PATCH /api/operator/settings': 'manage-people',
  'GET /api/operator/signing-key': 'read-published',
  'POST /api/operator/signing-key/rotate': 'manage-people',
  'GET /api/aircraft-types': 'read-published',
  'GET /api/aircraft-types/:id': 'read-published',
  'POST /api/aircraft-types': 'manage-fleet',
  'PATCH /api/aircraft-types/:id': 'manage-fleet',
  'GET /api/airframes': 'read-published',
  'GET /api/airframes/:id': 'read-published',
  'POST /api/airframes': 'manage-fleet',
  'PATCH /api/airframes/:id': 'manage-fleet',
  'GET /api/airframes/:id/card.pdf': 'print-card-batches',
  'POST /api/airframes/:id/card.pdf': 'print-card-batches',
  'GET /api/speed-books': 'read-published',
  'GET /api/speed-books/:id': 'read-published',
  'POST /api/speed-books': 'edit-speed-books',
  'POST /api/speed-books/:id/revisions': 'edit-speed-books',
  'GET /api/revisions/:id': 'read-published',
  'PATCH /api/revisions/:id': 'edit-speed-books',
  'DELETE /api/revisions/:id': 'edit-speed-books',
  'POST /api/revisions/:id/submit': 'edit-speed-books',
  'POST /api/revisions/:id/approve': 'publish-revisions',
  'POST /api/revisions/:id/return': 'publish-revisions',
  'POST /api/revisions/:id/withdraw': 'publish-revisions',
  'GET /api/revisions/:id/diff': 'read-published',
  'GET /api/revisions/:id/coverage': 'read-published',
  'POST /api/revisions/coverage': 'edit-speed-books',
  'GET /api/revisions/:id/attachments': 'read-published',
  'POST /api/revisions/:id/attachments': 'edit-speed-books',
  'GET /api/attachments/:id': 'read-published',
  'DELETE /api/attachments/:id': 'edit-speed-books',
  'POST /api/uploads/speed-table': 'edit-speed-books',
  'GET /api/sync': 'read-published',
  'GET /api/audit': 'read-audit',
  'POST /api/cards/preview': 'prepare-cards',
  'POST /api/card-issues': 'prepare-cards',
  'GET /api/card-issues': ['read-card-log', 'prepare-cards'],
  'GET /api/card-issues/:id': ['read-card-log', 'prepare-cards'],
};

/** Which record a route's `:id` names, to find another operator's one. */
function recordKind(route: string): keyof OtherIds | null {
  const path = route.split(' ')[1]!;
  if (!path.includes(':id')) return null;
  const prefix = path.split('/')[2]!;
  return ({ users: 'user', 'aircraft-types': 'aircraftType', airframes: 'airframe', 'speed-books': 'speedBook', revisions: 'revision', attachments: 'attachment', 'card-issues': 'cardIssue' } as const)[prefix] ?? null;
}

interface OtherIds {
  user: string;
  aircraftType: string;
  airframe: string;
  speedBook: string;
  revision: string;
  attachment: string;
  cardIssue: string;
}

function mayCall(rule: Rule, role: Role): boolean {
  if (rule === 'public' || rule === 'signed-in') return true;
  return (typeof rule === 'string' ? [rule] : rule).some((capability) => can(role, capability as Capability));
}

let harness: Harness;
const sessions = {} as Record<Role, { agent: TestAgent; token: string }>;
const other = {} as OtherIds;

beforeAll(async () => {
  harness = startHarness();
  const ours = await newTeam(harness.app, [...ROLES]);
  for (const [i, role] of ROLES.entries()) sessions[role] = ours[i]!;

  // Another operator with one record of each kind.
  const [admin, engineer, pilot] = await newTeam(harness.app, ['admin', 'engineer', 'pilot']);
  const { User } = await import('./models');
  const operatorId = (await User.findByPk(admin!.id, { rejectOnEmpty: true })).operatorId;
  const actor = (id: number, role: Role) => ({ operatorId, userId: id, role });
  const tag = randomBytes(3).toString('hex').toUpperCase();
  const type = await createAircraftType(actor(admin!.id, 'admin'), { designator: `M${tag}`, name: 'Matrix type (invented)', category: 'piston-single', engines: 1, ceilingFt: 14000 });
  const airframe = await createAirframe(actor(admin!.id, 'admin'), { registration: `ZZ-${tag.slice(0, 5)}`, serial: 'M1', aircraftTypeId: type.id, active: true });
  const book = await createSpeedBook(actor(engineer!.id, 'engineer'), { aircraftTypeId: type.id, title: 'Matrix book' });
  const revision = await createRevision(actor(engineer!.id, 'engineer'), book.id, { content: demoPistonTrainerContent(), changeSummary: 'Matrix' });
  const attachment = await Attachment.create({
    operatorId, revisionId: revision.id, originalName: 'matrix.pdf', contentType: 'application/pdf', sizeBytes: 1, sha256: '0'.repeat(64), storageName: randomBytes(16).toString('hex'), uploadedById: engineer!.id,
  });
  const cardIssue = await CardIssue.create({
    id: randomUUID(), code: `M${randomBytes(4).toString('hex').toUpperCase()}`.slice(0, 9), operatorId, issuedById: pilot!.id, airframeId: airframe.id, revisionId: revision.id,
    inputs: '{}', digest: '0'.repeat(64), entrySha256: '0'.repeat(64), issuedAt: new Date(), receivedAt: new Date(),
  });
  Object.assign(other, {
    user: String(pilot!.id), aircraftType: String(type.id), airframe: String(airframe.id), speedBook: String(book.id),
    revision: String(revision.id), attachment: String(attachment.id), cardIssue: cardIssue.id,
  });
}, 120_000);
afterAll(() => harness.close());

/** The path with ids that exist nowhere (or another operator's, when given). */
function pathFor(route: string, otherId?: string): string {
  const path = route.split(' ')[1]!;
  const missing = path.startsWith('/api/card-issues/') ? randomUUID() : '2147480000';
  return path.replace(':id', otherId ?? missing).replace(':code', 'K7M4RTX9X');
}

async function call(route: string, who: { agent: TestAgent; token: string }, otherId?: string) {
  const method = route.split(' ')[0]!.toLowerCase() as 'get' | 'post' | 'patch' | 'delete';
  const req = who.agent[method](pathFor(route, otherId));
  const res = method === 'get' ? await req : await req.set('x-csrf-token', who.token).send({});
  return { status: res.status, code: (res.body as { error?: { code?: string } })?.error?.code ?? null };
}

it('knows what every route the server registers needs', () => {
  const served = appRoutes(harness.app);
  expect({ withoutRule: served.filter((route) => !(route in ACCESS)) }).toEqual({ withoutRule: [] });
  expect(served.length).toBeGreaterThan(40);
});

describe.each(Object.keys(ACCESS))('%s', (route) => {
  const rule = ACCESS[route]!;

  it('answers signed out, every role and another operator’s ids as the roles table says', async () => {
    const wrong: string[] = [];
    const anonymous = await call(route, await csrfAgent(harness.app));
    if (rule === 'public' ? [401, 403].includes(anonymous.status) : anonymous.status !== 401) wrong.push(`signed out: ${anonymous.status}`);
    if (anonymous.status >= 500) wrong.push(`signed out: ${anonymous.status}`);
    if (rule !== 'public') {
      for (const role of ROLES) {
        const own = await call(route, sessions[role]);
        if (mayCall(rule, role)) {
          if ([401, 403].includes(own.status) || own.status >= 500) wrong.push(`${role}: ${own.status} ${own.code}`);
          const kind = recordKind(route);
          if (kind) {
            const theirs = await call(route, sessions[role], other[kind]);
            const again = await call(route, sessions[role]);
            if (theirs.status !== again.status || theirs.code !== again.code) {
              wrong.push(`${role}, another operator's ${kind}: ${theirs.status} ${theirs.code}, but ${again.status} ${again.code} for an id that does not exist`);
            }
          }
        } else if (own.status !== 403 || own.code !== 'forbidden') {
          wrong.push(`${role}: ${own.status} ${own.code}, expected 403 forbidden`);
        }
      }
    }
    expect(wrong).toEqual([]);
  });
});
