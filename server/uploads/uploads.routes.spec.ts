import request from 'supertest';
import { speedTableUploadSchema } from '@shared/api/uploads';
import { csrfAgent, demoEmail, signIn, startHarness, type Harness } from '../../test/api/harness';
import { sessionOf } from '../../test/api/role-sessions';

let harness: Harness;
beforeAll(() => {
  harness = startHarness();
});
afterAll(() => harness.close());

const GOOD_TABLE = 'configuration_key,ias_kt,cas_kt\nclean,60,63\nclean,80,81\nclean,120,119\n';

async function upload(role: Parameters<typeof demoEmail>[0], body: Buffer | string, filename = 'table.csv', contentType = 'text/csv', domain = 'demo') {
  const { agent, token } = await sessionOf(harness.app, role, domain as 'demo' | 'second');
  return agent.post('/api/uploads/speed-table').set('x-csrf-token', token).attach('file', Buffer.from(body), { filename, contentType });
}

describe('POST /api/uploads/speed-table', () => {
  it('answers a good position-error table in the shape of revision content, and stores nothing', async () => {
    const res = await upload('engineer', GOOD_TABLE);
    expect(res.status).toBe(200);
    const parsed = speedTableUploadSchema.parse(res.body);
    expect(parsed).toMatchObject({
      layout: 'position-error',
      errors: [],
      configurations: [{ key: 'clean', positionError: [{ iasKt: 60, casKt: 63 }, { iasKt: 80, casKt: 81 }, { iasKt: 120, casKt: 119 }] }],
    });
    expect(parsed.rows).toHaveLength(3);
  });

  it('answers a tabulated speed against weight and altitude as nested values', async () => {
    const csv = 'speed_code,configuration_key,weight_kg,pressure_altitude_ft,value_kt\nVR,takeoff-flap,900,0,50\nVR,takeoff-flap,900,4000,52\nVR,takeoff-flap,1100,0,55\nVR,takeoff-flap,1100,4000,58\n';
    const res = await upload('approver', csv);
    expect(res.status).toBe(200);
    expect(speedTableUploadSchema.parse(res.body)).toMatchObject({
      layout: 'tabulated-speed',
      errors: [],
      speeds: [{ code: 'VR', configurationKey: 'takeoff-flap', table: { byWeightKg: [900, 1100], byPressureAltitudeFt: [0, 4000], valuesKt: [[50, 52], [55, 58]] } }],
    });
  });

  it('answers bad rows with line, column and reason', async () => {
    const res = await upload('engineer', 'configuration_key,ias_kt,cas_kt\nclean,60,63\nclean,sixty,64\nclean,50,52\n');
    expect(res.status).toBe(200);
    expect(res.body.errors).toEqual([
      { line: 3, column: 'ias_kt', reason: '"sixty" is not a number; enter an IAS in kt.' },
      { line: 4, column: 'ias_kt', reason: 'IAS must rise down the table: 50 kt comes after 60 kt (line 2) for "clean".' },
    ]);
    expect(res.body.configurations).toEqual([]);
  });

  it('refuses a file whose header fits no layout with 422 and a sentence', async () => {
    const res = await upload('engineer', 'speed,knots\nVR,55\n');
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ code: 'unusable_csv', message: expect.stringMatching(/configuration_key,ias_kt,cas_kt/) });
  });

  it('refuses text that is not UTF-8 and files that are not CSV', async () => {
    const latin1 = Buffer.from('configuration_key,ias_kt,cas_kt\nfl\xe4che,60,61\n', 'latin1');
    const notUtf8 = await upload('engineer', latin1);
    expect(notUtf8.status).toBe(422);
    expect(notUtf8.body.error.message).toMatch(/not UTF-8/);

    const image = await upload('engineer', Buffer.from([0x89, 0x50, 0x4e, 0x47]), 'table.png', 'image/png');
    expect(image.status).toBe(415);
    expect(image.body.error).toMatchObject({ code: 'unsupported_file_type', fields: { file: expect.any(String) } });
  });

  it('refuses a table whose axes would need millions of grid points at once with 422, and keeps answering', async () => {
    // Security issue 12, finding 2: 200 rows, each with a new weight, altitude and OAT, used to
    // make the parser build all 200³ combinations (9 s, 1.9 GB). A few kB of CSV.
    const rows = Array.from({ length: 200 }, (_, i) => `VR,takeoff-flap,${1000 + i},${i * 10},${-40 + i * 0.25},${60 + i * 0.1}`);
    const res = await upload('engineer', `speed_code,configuration_key,weight_kg,pressure_altitude_ft,oat_c,value_kt\n${rows.join('\n')}\n`);
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({
      code: 'csv_too_large',
      message: expect.stringContaining('VR (takeoff-flap) would need 8,000,000 grid points (200 weights × 200 pressure altitudes × 200 OATs), one row each, and the file has 200 rows for it'),
      fields: { file: expect.any(String) },
    });
    await request(harness.app).get('/api/health').expect(200);
    const good = await upload('engineer', GOOD_TABLE);
    expect(good.status).toBe(200);
  });

  it('refuses cells and headers longer than any layout needs with 422', async () => {
    const longCell = await upload('engineer', `configuration_key,ias_kt,cas_kt\nclean,60,${'6'.repeat(5000)}\n`);
    expect(longCell.status).toBe(422);
    expect(longCell.body.error.message).toBe('Line 2, column 3 holds 5,000 characters; no value of these layouts is longer than 100.');
    const wide = await upload('engineer', `${Array.from({ length: 30_000 }, (_, i) => `c${i}`).join(',')}\n${'1,'.repeat(29_999)}1\n`);
    expect(wide.status).toBe(422);
    expect(wide.body.error.message).toContain('The header has 30000 columns');
  });

  it('answers 413 above 256 kB', async () => {
    const big = `configuration_key,ias_kt,cas_kt\n${'clean,60,61\n'.repeat(23_000)}`;
    expect(Buffer.byteLength(big)).toBeGreaterThan(256 * 1024);
    const res = await upload('engineer', big);
    expect(res.status).toBe(413);
    expect(res.body.error).toMatchObject({ code: 'file_too_large', message: expect.stringMatching(/256 kB/) });
  });

  it('asks for the file when none is sent, and for multipart when JSON is', async () => {
    const { agent, token } = await signIn(harness.app, demoEmail('engineer'));
    const none = await agent.post('/api/uploads/speed-table').set('x-csrf-token', token).field('note', 'no file');
    expect(none.status).toBe(400);
    expect(none.body.error.fields).toEqual({ file: 'Choose a file to upload.' });
    const json = await agent.post('/api/uploads/speed-table').set('x-csrf-token', token).send({ file: GOOD_TABLE });
    expect(json.status).toBe(415);
    const wrongField = await agent.post('/api/uploads/speed-table').set('x-csrf-token', token).attach('table', Buffer.from(GOOD_TABLE), 'table.csv');
    expect(wrongField.status).toBe(400);
  });

  it.each(['pilot', 'admin', 'inspector'] as const)('answers 403 to a %s', async (role) => {
    const res = await upload(role, GOOD_TABLE);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
  });

  it.each(['engineer', 'approver'] as const)('lets a %s upload', async (role) => {
    expect((await upload(role, GOOD_TABLE)).status).toBe(200);
  });

  it('answers 403 to the second operator’s admin and pilot, 401 when signed out', async () => {
    expect((await upload('admin', GOOD_TABLE, 'table.csv', 'text/csv', 'second')).status).toBe(403);
    expect((await upload('pilot', GOOD_TABLE, 'table.csv', 'text/csv', 'second')).status).toBe(403);
    const { agent, token } = await csrfAgent(harness.app);
    const res = await agent.post('/api/uploads/speed-table').set('x-csrf-token', token).attach('file', Buffer.from(GOOD_TABLE), 'table.csv');
    expect(res.status).toBe(401);
    expect((await request(harness.app).post('/api/uploads/speed-table').attach('file', Buffer.from(GOOD_TABLE), 'table.csv')).status).toBe(403);
  });

});
