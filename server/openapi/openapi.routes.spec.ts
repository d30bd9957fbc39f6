import request from 'supertest';
import { appRoutes as appRoutesOf } from '../../test/api/app-routes';
import { startHarness, type Harness } from '../../test/api/harness';

let harness: Harness;
beforeAll(() => {
  harness = startHarness();
});
afterAll(() => harness.close());

const appRoutes = () => appRoutesOf(harness.app);

describe('GET /api/openapi.json', () => {
  it('describes every route of the app, generated from the zod schemas', async () => {
    const res = await request(harness.app).get('/api/openapi.json').expect(200);
    expect(res.body.openapi).toBe('3.1.0');
    const documented = Object.entries(res.body.paths as Record<string, Record<string, unknown>>)
      .flatMap(([path, operations]) => Object.keys(operations).map((method) => `${method.toUpperCase()} ${path.replace(/\{(\w+)\}/g, ':$1')}`))
      .sort();
    const served = appRoutes();
    expect(served.length).toBeGreaterThan(20);
    // A route missing here needs its line in server/openapi/openapi.document.ts.
    expect({ undocumented: served.filter((route) => !documented.includes(route)) }).toEqual({ undocumented: [] });
    expect(documented).toEqual(
      expect.arrayContaining([
        'GET /api/health',
        'POST /api/auth/login',
        'GET /api/users',
        'POST /api/revisions/:id/approve',
        'GET /api/revisions/:id/diff',
        'GET /api/audit',
        'GET /api/operator/signing-key',
      ]),
    );
  });

  it('carries the request schemas: the revision content and the field rules of a body', async () => {
    const res = await request(harness.app).get('/api/openapi.json').expect(200);
    const content = res.body.components.schemas.RevisionContent;
    expect(content.required).toEqual(expect.arrayContaining(['schemaVersion', 'aircraft', 'weights', 'configurations', 'speeds', 'limits', 'indicatorMarkingBasis', 'notes']));
    const createType = res.body.paths['/api/aircraft-types'].post.requestBody.content['application/json'].schema;
    expect(createType.properties.category.enum).toEqual(['piston-single', 'piston-twin', 'turboprop', 'jet']);
    expect(createType.additionalProperties).toBe(false);
    const approve = res.body.paths['/api/revisions/{id}/approve'].post;
    expect(Object.keys(approve.responses)).toEqual(expect.arrayContaining(['200', '401', '403', '404', '409']));
    expect(res.body.paths['/api/audit'].get.parameters.map((p: { name: string }) => p.name)).toEqual(expect.arrayContaining(['entityType', 'actorId', 'from', 'to', 'limit', 'cursor']));
  });
});
