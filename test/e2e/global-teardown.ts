import '../support/shared-alias';
import { stopLocalInstance } from '../../db/local';

export default async function globalTeardown(): Promise<void> {
  const running = globalThis.speedwrightE2e;
  if (!running) return;
  await running.stop();
  if (running.startedDb) await stopLocalInstance('test');
}
