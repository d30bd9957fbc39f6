import type TestAgent from 'supertest/lib/agent';
import { syncResponseSchema } from '../../shared/api/sync';
import { cardIssueBatchResponseSchema } from '../../shared/card/card-api';
import type { SyncTransport } from '../../src/app/core/sync/device-sync';

/**
 * The device's two sync calls over a signed-in supertest agent, so Node tests drive the
 * device's sync core (src/app/core/sync/device-sync.ts) against the real server. A failed call
 * throws what the app's transport throws: an error with the HTTP `status` and the server's
 * sentence as `message`.
 */
export function deviceSyncTransport(agent: TestAgent, csrfToken: string): SyncTransport {
  const failure = (status: number, body: unknown) =>
    Object.assign(new Error((body as { error?: { message?: string } })?.error?.message ?? `The server answered ${status}.`), { status });
  return {
    async fetchChanges(cursor) {
      const res = await agent.get('/api/sync').query(cursor ? { cursor } : {});
      if (res.status !== 200) throw failure(res.status, res.body);
      return syncResponseSchema.parse(res.body);
    },
    async sendCardIssues(entries) {
      const res = await agent.post('/api/card-issues').set('x-csrf-token', csrfToken).send({ entries });
      if (res.status !== 200) throw failure(res.status, res.body);
      return cardIssueBatchResponseSchema.parse(res.body).results;
    },
  };
}
