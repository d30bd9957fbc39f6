/**
 * Set to `1` by `test/run.ts` after it has built the web app and the server: the production
 * tests then install that build as it is instead of building the server again.
 */
export const REUSE_BUILD_VARIABLE = 'SPEEDWRIGHT_REUSE_BUILD';
