import { contentSha256 } from '@shared/speed-book/canonical';
import { revisionContentProblems } from '@shared/speed-book/revision-content';
import { signedRevisionStatement } from '@shared/speed-book/signature';
import { startHarness, TEST_SIGNING_KEY_SECRET, type Harness } from '../../test/api/harness';
import { AircraftType, Airframe, Operator, Revision, SigningKey, SpeedBook } from '../models';
import { verifyStatement } from '../revisions/signing';
import { DEMO_OPERATORS, seedDemoFleet } from './demo-seed';

jest.setTimeout(60_000);

let harness: Harness;
beforeAll(() => {
  harness = startHarness();
});
afterAll(() => harness.close());

async function demoOperator(slug = 'kestrel-fen') {
  return Operator.findOne({ where: { slug }, rejectOnEmpty: true });
}

describe('the demo seed', () => {
  it('gives the demo operator three invented types, ZZ- airframes and one speed book each', async () => {
    const operator = await demoOperator();
    const types = await AircraftType.findAll({ where: { operatorId: operator.id, designator: ['ZZP1', 'ZZT2', 'ZZJ2'] }, order: [['designator', 'ASC']] });
    expect(types.map((t) => [t.designator, t.category, t.engines])).toEqual([
      ['ZZJ2', 'jet', 2],
      ['ZZP1', 'piston-single', 1],
      ['ZZT2', 'turboprop', 2],
    ]);
    expect(types.every((t) => t.name.includes('invented'))).toBe(true);
    // The seed's own airframes (other test files add airframes of their own meanwhile).
    const seeded = DEMO_OPERATORS[0].fleet.flatMap((t) => t.airframes.map((a) => a.registration));
    expect(seeded).toHaveLength(6);
    expect(seeded.every((registration) => /^ZZ-[A-Z]{3}$/.test(registration))).toBe(true);
    const airframes = await Airframe.findAll({ where: { operatorId: operator.id, registration: seeded } });
    expect(airframes.map((a) => a.registration).sort()).toEqual([...seeded].sort());
    expect(airframes.every((a) => types.some((t) => t.id === a.aircraftTypeId))).toBe(true);
    expect(await SpeedBook.count({ where: { operatorId: operator.id, aircraftTypeId: types.map((t) => t.id) } })).toBe(3);
  });

  it('publishes valid, signed revisions marked as invented; the trainer’s first is superseded by its second', async () => {
    const operator = await demoOperator();
    const key = await SigningKey.findOne({ where: { operatorId: operator.id, active: true }, rejectOnEmpty: true });
    for (const designator of ['ZZP1', 'ZZT2', 'ZZJ2']) {
      const type = await AircraftType.findOne({ where: { operatorId: operator.id, designator }, rejectOnEmpty: true });
      const book = await SpeedBook.findOne({ where: { aircraftTypeId: type.id }, rejectOnEmpty: true });
      const revisions = await Revision.findAll({ where: { speedBookId: book.id }, order: [['number', 'ASC']] });
      expect([designator, revisions.map((r) => r.status)]).toEqual([designator, designator === 'ZZP1' ? ['superseded', 'published'] : ['published']]);
      for (const revision of revisions) {
        const content = JSON.parse(revision.content) as { notes: string };
        expect(revisionContentProblems(content)).toEqual({});
        expect(content.notes).toMatch(/^Invented demo data — not for flight\./);
        expect(revision.contentSha256).toBe(contentSha256(content));
        const statement = signedRevisionStatement({
          operatorId: operator.id,
          speedBookId: book.id,
          revisionId: revision.id,
          number: revision.number,
          contentSha256: revision.contentSha256!,
          publishedAt: revision.publishedAt!.toISOString(),
        });
        expect(verifyStatement(key.publicKey, statement, revision.signature!)).toBe(true);
        expect(revision.authorId).not.toBe(revision.approverId);
      }
    }
  });

  it('gives the second operator one type and one airframe of its own', async () => {
    const second = await demoOperator('second-demo');
    const type = await AircraftType.findOne({ where: { operatorId: second.id, designator: 'ZZP2' }, rejectOnEmpty: true });
    expect(await Airframe.findOne({ where: { operatorId: second.id, registration: 'ZZ-LAT', aircraftTypeId: type.id } })).not.toBeNull();
  });

  it('changes nothing when run again', async () => {
    // Only the seed's own records: other test files add records of their own meanwhile.
    const registrations = DEMO_OPERATORS.flatMap((o) => o.fleet.flatMap((t) => t.airframes.map((a) => a.registration)));
    const count = async () => {
      const types: AircraftType[] = [];
      for (const seedOperator of DEMO_OPERATORS) {
        const operator = await demoOperator(seedOperator.slug);
        types.push(...(await AircraftType.findAll({ where: { operatorId: operator.id, designator: seedOperator.fleet.map((t) => t.designator) }, attributes: ['id'] })));
      }
      const books = await SpeedBook.findAll({ where: { aircraftTypeId: types.map((t) => t.id) }, attributes: ['id'] });
      return {
        types: types.length,
        airframes: await Airframe.count({ where: { registration: registrations } }),
        books: books.length,
        revisions: await Revision.count({ where: { speedBookId: books.map((b) => b.id) } }),
      };
    };
    const before = await count();
    expect(before).toEqual({ types: 4, airframes: 7, books: 3, revisions: 4 });
    await seedDemoFleet(harness.sequelize, TEST_SIGNING_KEY_SECRET);
    expect(await count()).toEqual(before);
  });
});
