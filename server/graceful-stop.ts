/**
 * Graceful stop of an HTTP server (SIGTERM; main.ts): the listening socket closes at once, so a
 * new connection is refused (a proxy in front tries another instance; with Node's cluster the
 * port closes when the last server process has let go of it); requests in flight finish, for at
 * most the grace period, and their answers say `Connection: close`, so no keep-alive client
 * sends another request into a closing process; idle kept-alive connections are closed as they
 * become idle. After the grace period the connections still open are cut. Common practice for
 * servers behind a load balancer; Node's `server.close()` alone would leave a kept-alive
 * connection open after its answer (until `keepAliveTimeout`), and say `keep-alive` in it.
 */
import type { Server, ServerResponse } from 'node:http';

/** How often idle kept-alive connections are looked for while draining. */
const IDLE_SWEEP_MS = 100;

export interface StopOutcome {
  /** Requests that were being answered when the stop began. */
  inFlight: number;
  /** Requests still unanswered when the grace period ended (their connections were cut). */
  cut: number;
}

export interface GracefulStopper {
  /** Stops accepting, lets answers in flight finish for at most `graceMs`, then resolves once the server is closed. */
  stop(graceMs: number): Promise<StopOutcome>;
}

/** Watches `server`'s requests from now on; call it right after creating the server. */
export function gracefulStopper(server: Server): GracefulStopper {
  const unanswered = new Set<ServerResponse>();
  let draining = false;
  let stopping: Promise<StopOutcome> | undefined;

  server.prependListener('request', (_req, res: ServerResponse) => {
    if (draining) res.setHeader('Connection', 'close');
    unanswered.add(res);
    res.once('close', () => unanswered.delete(res));
  });

  const stop = async (graceMs: number): Promise<StopOutcome> => {
    draining = true;
    const inFlight = unanswered.size;
    for (const res of unanswered) if (!res.headersSent) res.setHeader('Connection', 'close');
    const closed = new Promise<void>((resolve) => server.close(() => resolve()));
    server.closeIdleConnections();
    const sweep = setInterval(() => server.closeIdleConnections(), IDLE_SWEEP_MS);
    let cut = 0;
    const deadline = setTimeout(() => {
      cut = unanswered.size;
      server.closeAllConnections();
    }, graceMs);
    try {
      await closed;
    } finally {
      clearInterval(sweep);
      clearTimeout(deadline);
    }
    return { inFlight, cut };
  };

  return {
    stop(graceMs) {
      stopping ??= stop(graceMs);
      return stopping;
    },
  };
}
