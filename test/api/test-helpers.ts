/**
 * Helpers for the API tests of speed books and revisions: signed-in agents by role, a fresh
 * aircraft type with its speed book, extra people. Each test makes its own records so the
 * files can run side by side on one database.
 */
import { randomBytes } from 'node:crypto';
import type TestAgent from 'supertest/lib/agent';
import type { Role } from '@shared/auth/roles';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import type { RevisionContent } from '@shared/speed-book/revision-content';
import { signIn, TEST_PASSWORD, type Harness } from './harness';
import { sessionOf } from './role-sessions';
import { hashPassword } from '../../server/auth/passwords';
import { Operator, User } from '../../server/models';

export interface Session {
  agent: TestAgent;
  token: string;
}

export type SessionsByRole = Record<Role, Session> & { secondAdmin: Session; secondPilot: Session };

/**
 * One session per demo role and for the second operator's admin and pilot, through
 * test/api/role-sessions.ts (which gives the two people the lockout tests lock a person of
 * their own).
 */
export async function signInEveryone(app: Harness['app']): Promise<SessionsByRole> {
  const roles: Role[] = ['pilot', 'engineer', 'approver', 'admin', 'inspector'];
  const sessions = {} as SessionsByRole;
  for (const role of roles) sessions[role] = await sessionOf(app, role);
  sessions.secondAdmin = await sessionOf(app, 'admin', 'second');
  sessions.secondPilot = await sessionOf(app, 'pilot', 'second');
  return sessions;
}

const unique = () => randomBytes(3).toString('hex').toUpperCase();

/**
 * A new person of an existing operator (password TEST_PASSWORD), signed in. Mind that other
 * test files list the demo operators' people; `newTeam` keeps extra people apart.
 */
export async function newPerson(app: Harness['app'], role: Role, operatorSlug = 'kestrel-fen'): Promise<Session & { id: number }> {
  const operator = await Operator.findOne({ where: { slug: operatorSlug }, rejectOnEmpty: true });
  const email = `${role}-${unique().toLowerCase()}@test.speedwright.example`;
  const user = await User.create({
    operatorId: operator.id,
    email,
    displayName: `Test ${role} ${email.slice(0, 12)}`,
    role,
    passwordHash: await hashPassword(TEST_PASSWORD),
    lockedUntil: null,
    lastSignInAt: null,
  });
  return { ...(await signIn(app, email)), id: user.id };
}

/**
 * A new operator of its own with one person per entry of `roles` (password TEST_PASSWORD),
 * each signed in. Tests that need extra people make them here, never in the demo operator,
 * whose list of people other test files check.
 */
export async function newTeam(app: Harness['app'], roles: Role[]): Promise<(Session & { id: number })[]> {
  const slug = `test-team-${unique().toLowerCase()}`;
  const operator = await Operator.create({ slug, name: `Test team ${slug} (invented)`, isDemo: true });
  const passwordHash = await hashPassword(TEST_PASSWORD);
  const team: (Session & { id: number })[] = [];
  for (const [i, role] of roles.entries()) {
    const email = `${role}-${i}@${slug}.speedwright.example`;
    const user = await User.create({ operatorId: operator.id, email, displayName: `Test ${role} ${i}`, role, passwordHash, lockedUntil: null, lastSignInAt: null });
    team.push({ ...(await signIn(app, email)), id: user.id });
  }
  return team;
}

/** A new piston-single type (admin) and its empty speed book (engineer); ids of both. */
export async function newSpeedBook(admin: Session, engineer: Session): Promise<{ aircraftTypeId: number; speedBookId: number }> {
  const type = await admin.agent
    .post('/api/aircraft-types')
    .set('x-csrf-token', admin.token)
    .send({ designator: `T${unique()}`, name: 'Test trainer (invented)', category: 'piston-single', engines: 1, ceilingFt: 14000 })
    .expect(201);
  const book = await engineer.agent
    .post('/api/speed-books')
    .set('x-csrf-token', engineer.token)
    .send({ aircraftTypeId: type.body.aircraftType.id, title: `Test book ${type.body.aircraftType.designator}` })
    .expect(201);
  return { aircraftTypeId: type.body.aircraftType.id as number, speedBookId: book.body.speedBook.id as number };
}

/** Creates a draft, submits it and has `approver` publish it; the revision's id. */
export async function publish(engineer: Session, approver: Session, speedBookId: number, content: RevisionContent = demoPistonTrainerContent()): Promise<number> {
  const draft = await engineer.agent
    .post(`/api/speed-books/${speedBookId}/revisions`)
    .set('x-csrf-token', engineer.token)
    .send({ content, changeSummary: 'Test revision' })
    .expect(201);
  const id = draft.body.revision.id as number;
  await engineer.agent.post(`/api/revisions/${id}/submit`).set('x-csrf-token', engineer.token).expect(200);
  await approver.agent.post(`/api/revisions/${id}/approve`).set('x-csrf-token', approver.token).expect(200);
  return id;
}
