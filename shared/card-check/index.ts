/**
 * The card check, framework-free (browser and Node): the card code (`card-code.ts`) and the
 * check URL with its compact payload (`check-url.ts`).
 */
export * from './card-code';
export * from './check-url';
export * from './verify-api';
export * from './figures-check';
