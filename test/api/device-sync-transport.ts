/**
 * A `SyncTransport` (src/app/core/sync/device-sync.ts) over a supertest agent, so Node tests
 * run the device's sync core — `runSync`, `flushOutbox`, `applySync` — with fake-indexeddb
 * against the real server. A failed call throws `{ status, message }` as the app's ApiClient
 * does (status 0 when no answer came).
 */
import type TestAgent from 'supertest/lib/agent';
import { syncResponseSchema } from '@shared/api/sync';
import { cardIssueBatchResponseSchema } from '@shared/card/card-api';
import type { SyncTransport } from '../../src/app/core/sync/device-sync';

export class TransportFailure extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
  }
}

function failureOf(res: { status: number; body: unknown }): TransportFailure {
  const message = (res.body as { error?: { message?: string } })?.error?.message ?? `The server answered HTTP ${res.status}.`;
  return new TransportFailure(res.status, message);
}

export function agentTransport(session: { agent: TestAgent; token: string }): SyncTransport {
  return {
    async fetchChanges(cursor) {
      let res;
      try {
        res = await session.agent.get('/api/sync').query(cursor ? { cursor } : {});
      } catch (error) {
        throw new TransportFailure(0, `No answer: ${(error as Error).message}`);
      }
      if (res.status !== 200) throw failureOf(res);
      return syncResponseSchema.parse(res.body);
    },
    async sendCardIssues(entries) {
      let res;
      try {
        res = await session.agent.post('/api/card-issues').set('x-csrf-token', session.token).send({ entries });
      } catch (error) {
        throw new TransportFailure(0, `No answer: ${(error as Error).message}`);
      }
      if (res.status !== 200) throw failureOf(res);
      return cardIssueBatchResponseSchema.parse(res.body).results;
    },
  };
}
