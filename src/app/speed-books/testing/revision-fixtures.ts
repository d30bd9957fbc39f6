/**
 * Revisions and speed books as the API answers them, for the component tests of the speed
 * books, the revision editor and the review. Figures: shared/speed-book/demo-content.ts.
 */
import type { SessionUser } from '@shared/api/auth';
import type { RevisionSummary, RevisionView } from '@shared/api/revisions';
import type { Role } from '@shared/auth/roles';
import type { SpeedBook } from '../revisions-api';

export const PEOPLE = { engineer: 3, approver: 4, otherApprover: 6 } as const;

export function sessionUser(role: Role, id: number = role === 'approver' ? PEOPLE.approver : role === 'engineer' ? PEOPLE.engineer : 2): SessionUser {
  return { id, email: `${role}@demo.speedwright.example`, displayName: `Demo ${role}`, role, operatorId: 1, operatorName: 'Kestrel Fen Aviation (demo)', operatorIsDemo: true };
}

export function revisionSummary(overrides: Partial<RevisionSummary> = {}): RevisionSummary {
  return {
    id: 8,
    speedBookId: 1,
    number: 2,
    status: 'published',
    changeSummary: 'VR and VX from AFM amendment 2.',
    authorId: PEOPLE.engineer,
    authorName: 'Ines Marlow',
    submittedAt: '2026-11-20T09:00:00.000Z',
    approverId: PEOPLE.approver,
    approverName: 'Tomas Reyl',
    publishedAt: '2026-11-21T10:30:00.000Z',
    supersededAt: null,
    withdrawnAt: null,
    contentSha256: 'a'.repeat(64),
    createdAt: '2026-11-19T08:00:00.000Z',
    updatedAt: '2026-11-21T10:30:00.000Z',
    ...overrides,
  };
}

export function revisionView(content: Record<string, unknown>, overrides: Partial<RevisionView> = {}): RevisionView {
  return {
    ...revisionSummary(),
    content,
    returnedAt: null,
    returnReason: null,
    withdrawnById: null,
    withdrawReason: null,
    signature: null,
    signingKeyId: null,
    problems: {},
    contributors: [{ userId: PEOPLE.engineer, name: 'Ines Marlow', kinds: ['created', 'edited', 'submitted'] }],
    ...overrides,
  };
}

export function speedBook(revisions: RevisionSummary[]): SpeedBook {
  return {
    id: 1,
    title: 'Sedgeling 4 speed book',
    aircraftTypeId: 11,
    currentRevision: revisions.find((r) => r.status === 'published') ?? null,
    revisions,
    createdAt: '2026-01-01T00:00:00.000Z',
    updatedAt: '2026-11-21T10:30:00.000Z',
  };
}

export const AIRCRAFT_TYPES = [
  { id: 11, designator: 'ZZP1', name: 'Sedgeling 4', category: 'piston-single', engines: 1, ceilingFt: 14000, createdAt: '2026-01-01T00:00:00.000Z', updatedAt: '2026-01-01T00:00:00.000Z' },
];
