import { setupZonelessTestEnv } from 'jest-preset-angular/setup-env/zoneless';

setupZonelessTestEnv();

// jsdom has no structuredClone; fake-indexeddb (Dexie's store under jsdom) clones every record
// with it. Node's serializer clones plain records the same way.
import { deserialize, serialize } from 'v8';
if (typeof globalThis.structuredClone !== 'function') {
  globalThis.structuredClone = <T>(value: T): T => deserialize(serialize(value)) as T;
}
