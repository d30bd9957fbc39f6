import { randomBytes } from 'node:crypto';
import { aircraftTypeListSchema, airframeListSchema } from '@shared/api/fleet';
import { startHarness, type Harness } from '../../test/api/harness';
import { AircraftType, Airframe, AuditEvent } from '../models';
import { signInEveryone, type Session, type SessionsByRole } from '../../test/api/test-helpers';

// Every step hashes or checks passwords or signs; on a busy two-core machine 5 s is short.
jest.setTimeout(30_000);

let harness: Harness;
let as: SessionsByRole;
beforeAll(async () => {
  harness = startHarness();
  as = await signInEveryone(harness.app);
}, 60_000);
afterAll(() => harness.close());

const write = (who: Session, method: 'post' | 'patch', path: string) => who.agent[method](path).set('x-csrf-token', who.token);
const code = () => randomBytes(2).toString('hex').toUpperCase();

describe('aircraft types', () => {
  it('lists the demo operator’s three invented types to every role, and only its own', async () => {
    for (const reader of [as.pilot, as.engineer, as.approver, as.admin, as.inspector]) {
      const { aircraftTypes } = aircraftTypeListSchema.parse((await reader.agent.get('/api/aircraft-types').expect(200)).body);
      expect(aircraftTypes.map((t) => t.designator)).toEqual(expect.arrayContaining(['ZZJ2', 'ZZP1', 'ZZT2']));
      expect(aircraftTypes.map((t) => t.designator)).not.toContain('ZZP2');
    }
    const second = aircraftTypeListSchema.parse((await as.secondPilot.agent.get('/api/aircraft-types').expect(200)).body);
    expect(second.aircraftTypes.map((t) => t.designator)).toContain('ZZP2');
    expect(second.aircraftTypes.map((t) => t.designator)).not.toEqual(expect.arrayContaining(['ZZJ2']));
    expect(second.aircraftTypes.map((t) => t.designator)).not.toEqual(expect.arrayContaining(['ZZT2']));
  });

  it('lets the admin add and change a type, with an audit event for each', async () => {
    const designator = `ZZ${code()}`;
    const created = await write(as.admin, 'post', '/api/aircraft-types').send({ designator: designator.toLowerCase(), name: ' Test glider tug ', category: 'piston-single', engines: 1, ceilingFt: 12000 }).expect(201);
    expect(created.body.aircraftType).toMatchObject({ designator, name: 'Test glider tug', category: 'piston-single', engines: 1, ceilingFt: 12000 });
    const id = created.body.aircraftType.id;
    const changed = await write(as.admin, 'patch', `/api/aircraft-types/${id}`).send({ ceilingFt: 13000 }).expect(200);
    expect(changed.body.aircraftType.ceilingFt).toBe(13000);
    const events = await AuditEvent.findAll({ where: { entityType: 'aircraft-type', entityId: String(id) }, order: [['id', 'ASC']] });
    expect(events.map((e) => e.action)).toEqual(['aircraft-type.created', 'aircraft-type.updated']);
    expect(events[1].detailsObject()).toEqual({ ceilingFt: { before: 12000, after: 13000 } });
  });

  it('refuses a designator the operator already uses with 409, and another operator may use it', async () => {
    const res = await write(as.admin, 'post', '/api/aircraft-types').send({ designator: 'ZZP1', name: 'Again', category: 'jet', engines: 2, ceilingFt: 41000 }).expect(409);
    expect(res.body.error.fields).toEqual({ designator: 'The designator ZZP1 is already one of your types.' });
    await write(as.secondAdmin, 'post', '/api/aircraft-types').send({ designator: 'ZZP1', name: 'Same code elsewhere', category: 'piston-single', engines: 1, ceilingFt: 10000 }).expect(201);
  });

  it('names each bad field and writes nothing', async () => {
    const before = await AircraftType.count();
    const res = await write(as.admin, 'post', '/api/aircraft-types').send({ designator: 'Z', category: 'glider', engines: 0, ceilingFt: 'high', wings: 2 }).expect(400);
    expect(res.body.error.fields).toEqual({
      designator: 'A designator is 2 to 8 letters and digits, such as ZZP1.',
      name: 'Give the type’s name.',
      category: 'Choose piston-single, piston-twin, turboprop or jet.',
      engines: 'At least one engine.',
      ceilingFt: 'Give the ceiling in feet.',
      wings: 'This field is not expected here.',
    });
    expect(await AircraftType.count()).toBe(before);
    await write(as.admin, 'patch', '/api/aircraft-types/1').send({}).expect(400);
  });

  it('refuses control characters, direction overrides and broken characters with a field message (issue 12, finding 11)', async () => {
    const typesBefore = await AircraftType.count();
    const typeRes = await write(as.admin, 'post', '/api/aircraft-types')
      .send({ designator: 'ZZQ9', name: 'Tug\u0007 bell', category: 'piston-single', engines: 1, ceilingFt: 12000 })
      .expect(400);
    expect(typeRes.body.error.fields.name).toBe('The name may not contain an invisible control character (U+0007); type it again without it.');
    expect(await AircraftType.count()).toBe(typesBefore);
    const type = (await AircraftType.findOne({ rejectOnEmpty: true })).id;
    const framesBefore = await Airframe.count();
    for (const [field, value, sentence] of [
      ['serial', 'S-1\u0000', /U\+0000/],
      ['serial', 'S-1\r\nX', /a line break/],
      ['serial', 'S-\u202E1', /a direction control \(U\+202E\)/],
      ['serial', 'S-\uD800', /a broken character/],
      ['registration', 'ZZ-K\u202EA', /a direction control/],
    ] as const) {
      const res = await write(as.admin, 'post', '/api/airframes').send({ registration: 'ZZ-KQA', serial: 'S-1', aircraftTypeId: type, [field]: value }).expect(400);
      expect(res.body.error.fields[field]).toMatch(sentence);
    }
    expect(await Airframe.count()).toBe(framesBefore);
  });

  it('answers 404 for another operator’s type and for ids that are not ids', async () => {
    const other = await AircraftType.findOne({ where: { designator: 'ZZP2' }, rejectOnEmpty: true });
    await as.admin.agent.get(`/api/aircraft-types/${other.id}`).expect(404);
    await write(as.admin, 'patch', `/api/aircraft-types/${other.id}`).send({ name: 'Mine now' }).expect(404);
    await as.admin.agent.get('/api/aircraft-types/abc').expect(404);
    await as.admin.agent.get('/api/aircraft-types/99999999999').expect(404);
    expect((await AircraftType.findByPk(other.id, { rejectOnEmpty: true })).name).not.toBe('Mine now');
  });
});

describe('airframes', () => {
  it('lists the fleet with ZZ- registrations, only the operator’s own', async () => {
    const { airframes } = airframeListSchema.parse((await as.pilot.agent.get('/api/airframes').expect(200)).body);
    expect(airframes.map((a) => a.registration)).toEqual(expect.arrayContaining(['ZZ-KFA', 'ZZ-KFB', 'ZZ-KFC', 'ZZ-KFJ', 'ZZ-KFT', 'ZZ-KFU']));
    expect(airframes.every((a) => a.registration.startsWith('ZZ-'))).toBe(true);
    expect(airframes.find((a) => a.registration === 'ZZ-KFC')?.active).toBe(false);
    const second = airframeListSchema.parse((await as.secondAdmin.agent.get('/api/airframes').expect(200)).body);
    expect(second.airframes.map((a) => a.registration)).toEqual(['ZZ-LAT']);
  });

  it('adds an airframe, upper-cases the registration, deactivates it', async () => {
    const type = await AircraftType.findOne({ where: { designator: 'ZZT2' }, rejectOnEmpty: true });
    const registration = `zz-${code()}`;
    const created = await write(as.admin, 'post', '/api/airframes').send({ registration, serial: 'MT2-900', aircraftTypeId: type.id }).expect(201);
    expect(created.body.airframe).toMatchObject({ registration: registration.toUpperCase(), active: true, aircraftTypeId: type.id });
    const changed = await write(as.admin, 'patch', `/api/airframes/${created.body.airframe.id}`).send({ active: false }).expect(200);
    expect(changed.body.airframe.active).toBe(false);
    await write(as.admin, 'post', '/api/airframes').send({ registration, serial: 'X', aircraftTypeId: type.id }).expect(409);
  });

  it('refuses registrations that are not registrations', async () => {
    const type = await AircraftType.findOne({ where: { designator: 'ZZT2' }, rejectOnEmpty: true });
    for (const registration of ['ZZKFA', 'ZZ-', 'ZZ-TOOLONG', 'Z Z-ABC', '']) {
      const res = await write(as.admin, 'post', '/api/airframes').send({ registration, serial: 'S1', aircraftTypeId: type.id }).expect(400);
      expect([registration, res.body.error.fields.registration]).toEqual([registration, expect.stringMatching(/^A registration looks like ZZ-KFA/)]);
    }
  });

  it('refuses another operator’s type as the airframe’s type, and another operator’s airframe', async () => {
    const otherType = await AircraftType.findOne({ where: { designator: 'ZZP2' }, rejectOnEmpty: true });
    const res = await write(as.admin, 'post', '/api/airframes').send({ registration: `ZZ-${code()}`, serial: 'S1', aircraftTypeId: otherType.id }).expect(422);
    expect(res.body.error.fields).toEqual({ aircraftTypeId: 'Choose one of your aircraft types.' });
    const otherAirframe = await Airframe.findOne({ where: { registration: 'ZZ-LAT' }, rejectOnEmpty: true });
    await as.pilot.agent.get(`/api/airframes/${otherAirframe.id}`).expect(404);
    await write(as.admin, 'patch', `/api/airframes/${otherAirframe.id}`).send({ active: false }).expect(404);
    expect((await Airframe.findByPk(otherAirframe.id, { rejectOnEmpty: true })).active).toBe(true);
  });
});
