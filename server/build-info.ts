/**
 * Whether this code runs as the compiled production build (`npm run build`, tools/build-server.ts
 * defines the variable at build time) rather than from the TypeScript sources under tsx or jest.
 * Setting the variable in the environment of a source run changes nothing that matters: the
 * compiled build only refuses development settings the sources accept.
 */
export const COMPILED_BUILD: boolean = process.env['SPEEDWRIGHT_COMPILED_BUILD'] === '1';
