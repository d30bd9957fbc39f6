/**
 * The server's supervisor: forks the server processes (Node's cluster, WEB_CONCURRENCY of them,
 * one included), and replaces one that dies unasked — a crashed request handler, memory run
 * out, a signal — after a back-off: 1 s, doubling with each death in a row of a process that
 * lived less than a minute, at most 30 s (exponential back-off with a cap; common practice for
 * process supervisors). A process that ran a minute or more starts the count again.
 */
import cluster, { type Worker } from 'node:cluster';

export const RESTART_FIRST_DELAY_MS = 1000;
export const RESTART_MAX_DELAY_MS = 30_000;
/** A process that lived this long before it died counts as healthy: its replacement starts after the first delay. */
export const RESTART_STEADY_MS = 60_000;

/** The wait before replacing a process that died after `quickDeathsInARow` short lives (1 for the first). */
export function restartDelayMs(quickDeathsInARow: number): number {
  const doublings = Math.max(0, Math.min(quickDeathsInARow - 1, 20));
  return Math.min(RESTART_MAX_DELAY_MS, RESTART_FIRST_DELAY_MS * 2 ** doublings);
}

export interface Supervisor {
  /** The port the first process listens on, once it does. */
  listening: Promise<number>;
  /** Stops every process (SIGTERM; they finish their answers) and resolves when all have ended. */
  stop(): Promise<void>;
}

export interface SuperviseOptions {
  count: number;
  /** Script the processes run (default: the one the primary runs). */
  exec?: string;
  /** Environment of the processes, over the primary's own. */
  env?: NodeJS.ProcessEnv;
  log?: (line: string) => void;
}

/**
 * Forks `count` server processes and keeps that many running until `stop()`. When a process ends
 * before any has ever listened (a configuration the server refuses), the supervisor gives up
 * and `listening` rejects: restarting would only fail again.
 */
export function superviseWorkers({ count, exec, env, log = (line) => console.error(line) }: SuperviseOptions): Supervisor {
  if (exec) cluster.setupPrimary({ exec });
  let stopping = false;
  let everListened = false;
  let quickDeaths = 0;
  const pendingRestarts = new Set<NodeJS.Timeout>();
  const started = new Map<Worker, number>();
  let resolveListening!: (port: number) => void;
  let rejectListening!: (error: Error) => void;
  const listening = new Promise<number>((resolve, reject) => {
    resolveListening = resolve;
    rejectListening = reject;
  });
  // Nobody may be waiting on it when the supervisor gives up.
  listening.catch(() => undefined);

  const fork = () => {
    const worker = cluster.fork(env);
    started.set(worker, Date.now());
    worker.on('listening', (address) => {
      everListened = true;
      resolveListening(address.port);
    });
  };

  const onExit = (worker: Worker, code: number | null, signal: string | null) => {
    const lifeMs = Date.now() - (started.get(worker) ?? Date.now());
    started.delete(worker);
    if (stopping) return;
    if (!everListened) {
      rejectListening(new Error(`The server process ended (${signal ?? code}) before it could serve; see the messages above.`));
      stopping = true;
      for (const other of started.keys()) other.process.kill('SIGTERM');
      return;
    }
    quickDeaths = lifeMs >= RESTART_STEADY_MS ? 1 : quickDeaths + 1;
    const delay = restartDelayMs(quickDeaths);
    log(`Server process ${worker.process.pid} ended (${signal ?? code}) after ${Math.round(lifeMs / 1000)} s; starting another in ${delay / 1000} s.`);
    const timer = setTimeout(() => {
      pendingRestarts.delete(timer);
      if (!stopping) fork();
    }, delay);
    pendingRestarts.add(timer);
  };
  cluster.on('exit', onExit);
  for (let i = 0; i < count; i++) fork();

  return {
    listening,
    stop: () => {
      stopping = true;
      for (const timer of pendingRestarts) clearTimeout(timer);
      pendingRestarts.clear();
      const running = [...started.keys()];
      return new Promise<void>((resolve) => {
        const ended = () => {
          if ([...started.keys()].length === 0) {
            cluster.off('exit', ended);
            cluster.off('exit', onExit);
            resolve();
          }
        };
        cluster.on('exit', ended);
        for (const worker of running) worker.process.kill('SIGTERM');
        ended();
      });
    },
  };
}
