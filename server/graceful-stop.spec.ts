/**
 * The graceful stop main.ts runs on SIGTERM, on a real HTTP server over loopback: the Speedwright
 * app (its readiness) behind a route that answers slowly, as a long card PDF or sync would.
 */
import express from 'express';
import type { Server } from 'node:http';
import { Agent, request as httpRequest } from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { startHarness, type Harness } from '../test/api/harness';
import { gracefulStopper } from './graceful-stop';

interface Answer {
  status: number;
  connection: string | undefined;
  body: string;
}

/** One GET over `agent` (keep-alive), resolved with the answer or rejected with the socket's error. */
function get(port: number, path: string, agent: Agent): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const req = httpRequest({ host: '127.0.0.1', port, path, agent }, (res) => {
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (chunk: string) => (body += chunk));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, connection: res.headers.connection, body }));
      res.on('error', reject);
    });
    req.on('error', reject);
    req.end();
  });
}

describe('graceful stop', () => {
  let harness: Harness;
  let server: Server;
  let port: number;
  let agent: Agent;
  let slowStarted: () => void;

  beforeEach(async () => {
    harness = startHarness();
    const outer = express();
    outer.get('/slow/:ms', (req, res) => {
      slowStarted();
      const timer = setTimeout(() => res.send(`answered after ${req.params['ms']} ms`), Number(req.params['ms']));
      res.once('close', () => clearTimeout(timer));
    });
    outer.use(harness.app);
    server = await new Promise<Server>((resolve) => {
      const listening = outer.listen(0, '127.0.0.1', () => resolve(listening));
    });
    port = (server.address() as AddressInfo).port;
    agent = new Agent({ keepAlive: true });
  });

  afterEach(async () => {
    agent.destroy();
    server.closeAllConnections();
    await harness.close();
  });

  it('lets a request in flight finish, refuses new connections, and says not ready meanwhile', async () => {
    const stopper = gracefulStopper(server);
    // A kept-alive connection that has answered once and is idle when the stop begins.
    expect((await get(port, '/api/health/live', agent)).status).toBe(200);
    const started = new Promise<void>((resolve) => (slowStarted = resolve));
    const slow = get(port, '/slow/1500', agent);
    await started;

    harness.beginDraining();
    const stopped = stopper.stop(10_000);

    // No new connection: the listening socket is closed.
    await expect(get(port, '/api/health/live', new Agent({ keepAlive: false }))).rejects.toMatchObject({ code: 'ECONNREFUSED' });
    // Readiness (asked of the app itself, as a balancer's probe on a kept connection would be) says why.
    const ready = await request(harness.app).get('/api/health/ready').expect(503);
    expect(ready.body).toMatchObject({ status: 'not-ready', reason: 'shutting_down' });

    // The slow answer arrives whole, telling the client to close the connection.
    await expect(slow).resolves.toEqual({ status: 200, connection: 'close', body: 'answered after 1500 ms' });
    await expect(stopped).resolves.toEqual({ inFlight: 1, cut: 0 });
    expect(server.listening).toBe(false);
  });

  it('cuts what is still unanswered when the grace period ends', async () => {
    const stopper = gracefulStopper(server);
    const started = new Promise<void>((resolve) => (slowStarted = resolve));
    const tooSlow = get(port, '/slow/60000', agent);
    await started;
    await expect(stopper.stop(300)).resolves.toEqual({ inFlight: 1, cut: 1 });
    await expect(tooSlow).rejects.toMatchObject({ code: 'ECONNRESET' });
  });
});
