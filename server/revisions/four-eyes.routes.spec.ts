/**
 * The four-eyes rule with every contributor (security issue 12, finding 1): whoever started,
 * changed, gave source pages to or submitted a revision may not approve it — the server answers
 * 403 with the reason — while an approver who contributed nothing may. The revision lists its
 * contributors and the approval's audit event names them.
 */
import { revisionResponseSchema } from '@shared/api/revisions';
import { demoPistonTrainerContent, demoPistonTrainerContentRevised } from '@shared/speed-book/demo-content';
import { startHarness, type Harness } from '../../test/api/harness';
import { AuditEvent } from '../models';
import { newSpeedBook, newTeam, type Session } from '../../test/api/test-helpers';

jest.setTimeout(60_000);

let harness: Harness;
let admin: Session, engineer: Session & { id: number }, approver: Session & { id: number }, secondApprover: Session & { id: number };
beforeAll(async () => {
  harness = startHarness();
  [admin, engineer, approver, secondApprover] = await newTeam(harness.app, ['admin', 'engineer', 'approver', 'approver']) as [Session, Session & { id: number }, Session & { id: number }, Session & { id: number }];
}, 90_000);
afterAll(() => harness.close());

const post = (who: Session, path: string) => who.agent.post(path).set('x-csrf-token', who.token);

/** A PDF's first bytes are all the content check needs. */
const PDF = Buffer.from('%PDF-1.7\n%\u00e2\u00e3\u00cf\u00d3\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n', 'latin1');

async function draftByEngineer(): Promise<number> {
  const { speedBookId } = await newSpeedBook(admin, engineer);
  const created = await post(engineer, `/api/speed-books/${speedBookId}/revisions`).send({ content: demoPistonTrainerContent(), changeSummary: 'First figures' }).expect(201);
  return created.body.revision.id as number;
}

describe('the four-eyes rule with every contributor', () => {
  it('refuses an approver who changed the figures and submitted, with the reason; another approver publishes it', async () => {
    const id = await draftByEngineer();
    await approver.agent.patch(`/api/revisions/${id}`).set('x-csrf-token', approver.token).send({ content: demoPistonTrainerContentRevised() }).expect(200);
    await post(approver, `/api/revisions/${id}/submit`).expect(200);

    const refused = await post(approver, `/api/revisions/${id}/approve`).expect(403);
    expect(refused.body.error).toMatchObject({
      code: 'forbidden',
      message: 'You changed it and submitted it, so you may not approve revision 1: nobody approves a revision they contributed to. Another approver must publish it.',
    });
    const still = revisionResponseSchema.parse((await approver.agent.get(`/api/revisions/${id}`).expect(200)).body).revision;
    expect(still.status).toBe('in_review');
    expect(still.contributors).toEqual([
      { userId: engineer.id, name: 'Test engineer 1', kinds: ['created'] },
      { userId: approver.id, name: 'Test approver 2', kinds: ['edited', 'submitted'] },
    ]);

    const published = revisionResponseSchema.parse((await post(secondApprover, `/api/revisions/${id}/approve`).expect(200)).body).revision;
    expect(published).toMatchObject({ status: 'published', approverId: secondApprover.id });
    const event = await AuditEvent.findOne({ where: { action: 'revision.approved', entityType: 'revision', entityId: String(id) }, rejectOnEmpty: true });
    expect(event.detailsObject()?.['contributors']).toEqual([
      'Test engineer 1 (started it)',
      'Test approver 2 (changed it and submitted it)',
    ]);
  });

  it('refuses an approver who only submitted someone else’s draft', async () => {
    const id = await draftByEngineer();
    await post(approver, `/api/revisions/${id}/submit`).expect(200);
    const refused = await post(approver, `/api/revisions/${id}/approve`).expect(403);
    expect(refused.body.error.message).toContain('You submitted it, so you may not approve revision 1');
  });

  it('refuses an approver who added a source page while the revision was in review', async () => {
    const id = await draftByEngineer();
    await post(engineer, `/api/revisions/${id}/submit`).expect(200);
    await post(approver, `/api/revisions/${id}/attachments`).attach('file', PDF, { filename: 'afm-5-3.pdf', contentType: 'application/pdf' }).expect(201);
    const refused = await post(approver, `/api/revisions/${id}/approve`).expect(403);
    expect(refused.body.error.message).toContain('You added or removed its source pages, so you may not approve revision 1');
    await post(secondApprover, `/api/revisions/${id}/approve`).expect(200);
  });
});
