import { startHarness, type Harness } from '../../test/api/harness';
import { AuditEvent, Operator, User } from '../models';
import { recordAudit } from './audit.service';

let harness: Harness;
beforeAll(() => {
  harness = startHarness();
});
afterAll(() => harness.close());

describe('recordAudit', () => {
  it('appends an event with its details and refuses to change or delete it', async () => {
    const operator = await Operator.findOne({ where: { slug: 'kestrel-fen' }, rejectOnEmpty: true });
    const admin = await User.findOne({ where: { email: 'admin@demo.speedwright.example' }, rejectOnEmpty: true });
    const event = await recordAudit({
      operatorId: operator.id,
      actorId: admin.id,
      action: 'test.recorded',
      entityType: 'test',
      entityId: 7,
      details: { why: 'a test' },
    });
    const stored = await AuditEvent.findByPk(event.id, { rejectOnEmpty: true });
    expect(stored).toMatchObject({ operatorId: operator.id, actorId: admin.id, action: 'test.recorded', entityType: 'test', entityId: '7' });
    expect(stored.detailsObject()).toEqual({ why: 'a test' });

    await expect(stored.update({ action: 'test.changed' })).rejects.toThrow(/append-only/);
    await expect(stored.destroy()).rejects.toThrow(/append-only/);
    await expect(AuditEvent.destroy({ where: { id: event.id } })).rejects.toThrow(/append-only/);
    await expect(AuditEvent.update({ action: 'x' }, { where: { id: event.id } })).rejects.toThrow(/append-only/);
    expect((await AuditEvent.findByPk(event.id, { rejectOnEmpty: true })).action).toBe('test.recorded');
  });

  it('writes nothing when the transaction of the change rolls back', async () => {
    const operator = await Operator.findOne({ where: { slug: 'kestrel-fen' }, rejectOnEmpty: true });
    const before = await AuditEvent.count();
    await expect(
      harness.sequelize.transaction(async (transaction) => {
        await recordAudit({ operatorId: operator.id, actorId: null, action: 'test.rolled-back', entityType: 'test', entityId: null }, transaction);
        throw new Error('the change failed');
      }),
    ).rejects.toThrow('the change failed');
    expect(await AuditEvent.count()).toBe(before);
  });
});
