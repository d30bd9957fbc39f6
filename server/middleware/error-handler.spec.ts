import express from 'express';
import request from 'supertest';
import { errorHandler } from './error-handler';

/**
 * A database that goes away mid-request (a Galera node killed, a connection cut) is answered 503
 * with a sentence, so clients and the load balancer try again; other database errors stay 500.
 * SQLSTATE class 08 is "connection exception" (ISO/IEC 9075).
 */
function appThrowing(error: unknown) {
  const app = express();
  app.get('/', () => {
    throw error;
  });
  app.use(errorHandler);
  return app;
}

/** An error shaped as Sequelize wraps a driver error. */
function databaseError(sqlState: string, errno: number, message: string, fatal = false) {
  return Object.assign(new Error(message), { name: 'SequelizeDatabaseError', parent: { sqlState, errno, message, fatal } });
}

describe('errorHandler and a lost database', () => {
  it('answers 503 when the connection closed under the query (08S01)', async () => {
    const res = await request(appThrowing(databaseError('08S01', 45009, 'socket has unexpectedly been closed'))).get('/').expect(503);
    expect(res.body.error).toMatchObject({ code: 'database_unavailable', message: 'The database is not reachable right now. Try again shortly.' });
  });

  it('answers 503 when a Galera node is outside the primary component (1047)', async () => {
    await request(appThrowing(databaseError('08S01', 1047, 'WSREP has not yet prepared node for application use'))).get('/').expect(503);
    await request(appThrowing(databaseError('HY000', 1047, 'WSREP has not yet prepared node for application use'))).get('/').expect(503);
  });

  it('answers 503 when the driver says the connection is gone (fatal), whatever the SQLSTATE', async () => {
    await request(appThrowing(databaseError('HY000', -104, 'read ECONNRESET', true))).get('/').expect(503);
  });

  it('keeps 500 for any other database error', async () => {
    const res = await request(appThrowing(databaseError('42S22', 1054, "Unknown column 'x'"))).get('/').expect(500);
    expect(res.body.error.code).toBe('internal_error');
  });
});
