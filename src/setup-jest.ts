import { setupZonelessTestEnv } from 'jest-preset-angular/setup-env/zoneless';

setupZonelessTestEnv();

// jsdom has no structuredClone; fake-indexeddb (Dexie's store under jsdom) clones every record
// with it. The records kept on the device are plain data (objects, arrays, strings, numbers,
// booleans, null, dates), which this copies the way structuredClone does.
function clonePlainData<T>(value: T): T {
  if (value === null || typeof value !== 'object') return value;
  if (value instanceof Date) return new Date(value.getTime()) as T;
  if (Array.isArray(value)) return value.map(clonePlainData) as T;
  const copy: Record<string, unknown> = {};
  for (const [key, entry] of Object.entries(value)) copy[key] = clonePlainData(entry);
  return copy as T;
}
if (typeof globalThis.structuredClone !== 'function') {
  globalThis.structuredClone = clonePlainData as typeof structuredClone;
}

// jsdom's crypto has no `subtle`; the device verifies revision signatures with WebCrypto
// (Ed25519), which Node's webcrypto provides as browsers do.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { webcrypto } = require('node:crypto') as typeof import('node:crypto');
if (!globalThis.crypto?.subtle) {
  Object.defineProperty(globalThis, 'crypto', { value: webcrypto, configurable: true });
}
