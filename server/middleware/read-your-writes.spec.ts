import express from 'express';
import session from 'express-session';
import type { Sequelize } from 'sequelize';
import request from 'supertest';
import { READ_YOUR_WRITES_MS, readYourWrites } from './read-your-writes';

/**
 * With read replicas, a session that wrote reads from the primary for a while (read-your-writes,
 * common practice); others, and every session once the window passed, read from the replicas.
 * A fake Sequelize captures the find hook; each route answers what a model find would be given.
 */
function appAt(clock: { now: number }) {
  let hook: ((options: { useMaster?: boolean }) => void) | undefined;
  const sequelize = { addHook: (_type: string, _name: string, fn: typeof hook) => (hook = fn) } as unknown as Sequelize;
  const app = express();
  app.use(session({ secret: 'read-your-writes-spec-secret-0123456789', resave: false, saveUninitialized: true }));
  app.use('/api', readYourWrites(sequelize, () => clock.now));
  const find = () => {
    const options: { useMaster?: boolean } = {};
    hook!(options);
    return { primary: options.useMaster === true };
  };
  app.get('/api/things', async (_req, res) => {
    await Promise.resolve(); // the context survives an await, as a model find's would
    res.json(find());
  });
  app.post('/api/things', (_req, res) => void res.json(find()));
  app.post('/api/auth/login', (_req, res) => void res.json(find()));
  return app;
}

describe('readYourWrites', () => {
  it('sends a writer’s reads to the primary for the window, then back to the replicas', async () => {
    const clock = { now: 1_000_000 };
    const agent = request.agent(appAt(clock));
    expect((await agent.get('/api/things').expect(200)).body).toEqual({ primary: false });
    expect((await agent.post('/api/things').expect(200)).body).toEqual({ primary: true });
    expect((await agent.get('/api/things').expect(200)).body).toEqual({ primary: true });
    clock.now += READ_YOUR_WRITES_MS + 1;
    expect((await agent.get('/api/things').expect(200)).body).toEqual({ primary: false });
  });

  it('leaves other sessions on the replicas, and a sign-in does not pin reads', async () => {
    const clock = { now: 1_000_000 };
    const app = appAt(clock);
    const writer = request.agent(app);
    const other = request.agent(app);
    await writer.post('/api/things').expect(200);
    expect((await other.get('/api/things').expect(200)).body).toEqual({ primary: false });
    await other.post('/api/auth/login').expect(200);
    expect((await other.get('/api/things').expect(200)).body).toEqual({ primary: false });
  });
});
