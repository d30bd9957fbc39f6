import { randomBytes } from 'node:crypto';
import { demoEmail, mailTo, mailsTo, startHarness, TEST_PUBLIC_URL, type Harness } from '../../test/api/harness';
import { AircraftType, Operator, SpeedBook, User } from '../models';
import { notifyRevisionPublished, notifyRevisionSubmitted, notifyRevisionWithdrawn } from './notifications';

let harness: Harness;
beforeAll(() => {
  harness = startHarness();
});
afterAll(() => harness.close());

const tag = () => randomBytes(3).toString('hex').toUpperCase();
const ids = async () => {
  const operator = await Operator.findOne({ where: { slug: 'kestrel-fen' }, rejectOnEmpty: true });
  const engineer = await User.findOne({ where: { email: demoEmail('engineer') }, rejectOnEmpty: true });
  const approver = await User.findOne({ where: { email: demoEmail('approver') }, rejectOnEmpty: true });
  return { operatorId: operator.id, engineerId: engineer.id, approverId: approver.id };
};

describe('revision mail', () => {
  it('tells the approvers, not the author, that a revision waits for review, with a link to it', async () => {
    const { operatorId, engineerId } = await ids();
    const title = `Book ${tag()}`;
    await notifyRevisionSubmitted({ id: 4242, number: 3, speedBookId: 7, speedBookTitle: title, changeSummary: 'New VR table', authorId: engineerId }, operatorId);
    const mail = await mailTo(demoEmail('approver'), (entry) => entry.subject.includes(title));
    expect(mail.subject).toBe(`Review needed: ${title}, revision 3`);
    expect(mail.text).toContain('Tobias Wren has submitted revision 3');
    expect(mail.text).toContain("What changed, in the author's words: New VR table");
    expect(mail.links).toEqual([`${TEST_PUBLIC_URL}/review/4242`]);
    expect(mailsTo(demoEmail('engineer')).some((entry) => entry.subject.includes(title))).toBe(false);
    expect(mailsTo(demoEmail('pilot')).some((entry) => entry.subject.includes(title))).toBe(false);
  });

  it('tells the pilots of the operator, and only them, about a publication; the title comes from the speed book', async () => {
    const { operatorId, approverId } = await ids();
    const type = await AircraftType.create({ operatorId, designator: `N${tag()}`, name: 'Notification test type (invented)', category: 'piston-single', engines: 1, ceilingFt: 12000 });
    const book = await SpeedBook.create({ operatorId, aircraftTypeId: type.id, title: `Looked-up book ${tag()}` });
    await notifyRevisionPublished({ id: 99, number: 2, speedBookId: book.id, changeSummary: null }, operatorId, { actorId: approverId });
    const mail = await mailTo(demoEmail('pilot'), (entry) => entry.subject.includes(book.title));
    expect(mail.subject).toBe(`New speed data: ${book.title}, revision 2`);
    expect(mail.text).toMatch(/make new ones before your next flight/);
    expect(mail.links).toEqual([`${TEST_PUBLIC_URL}/speed-books/${book.id}`]);
    expect(mailsTo(demoEmail('pilot', 'second')).some((entry) => entry.subject.includes(book.title))).toBe(false);
    expect(mailsTo(demoEmail('approver')).some((entry) => entry.subject.includes(book.title))).toBe(false);
  });

  it('gives the reason of a withdrawal', async () => {
    const { operatorId } = await ids();
    const title = `Book ${tag()}`;
    await notifyRevisionWithdrawn({ id: 5, number: 4, speedBookId: 1, speedBookTitle: title }, operatorId, 'VREF figures were for the wrong flap setting.');
    const mail = await mailTo(demoEmail('pilot'), (entry) => entry.subject.includes(title));
    expect(mail.subject).toBe(`Withdrawn: ${title}, revision 4`);
    expect(mail.text).toContain('Reason given: VREF figures were for the wrong flap setting.');
    expect(mail.text).toContain('Do not use speed cards made from this revision.');
  });

  it('sends after the commit, and nothing when the transaction rolls back', async () => {
    const { operatorId } = await ids();
    const committed = `Committed ${tag()}`;
    const rolledBack = `Rolled back ${tag()}`;
    await harness.sequelize.transaction(async (transaction) => {
      await notifyRevisionPublished({ id: 1, number: 1, speedBookId: 1, speedBookTitle: committed }, operatorId, { transaction });
      // Not yet: the transaction is still open.
      await new Promise((resolve) => setTimeout(resolve, 150));
      expect(mailsTo(demoEmail('pilot')).some((entry) => entry.subject.includes(committed))).toBe(false);
    });
    await mailTo(demoEmail('pilot'), (entry) => entry.subject.includes(committed));

    await expect(
      harness.sequelize.transaction(async (transaction) => {
        await notifyRevisionPublished({ id: 1, number: 1, speedBookId: 1, speedBookTitle: rolledBack }, operatorId, { transaction });
        throw new Error('publishing failed');
      }),
    ).rejects.toThrow('publishing failed');
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(mailsTo(demoEmail('pilot')).some((entry) => entry.subject.includes(rolledBack))).toBe(false);
  });

  it('never throws when the mail server is away; it logs instead', async () => {
    const { operatorId } = await ids();
    const away = startHarness({ SMTP_URL: 'smtp://127.0.0.1:9' });
    try {
      await expect(notifyRevisionPublished({ id: 1, number: 1, speedBookId: 1, speedBookTitle: 'Unsent' }, operatorId)).resolves.toBeUndefined();
    } finally {
      await away.close();
    }
  });
});
