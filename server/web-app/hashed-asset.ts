/**
 * Whether a file of the production build carries its content hash in its name, so that a browser
 * may keep it for a year without asking again. The Angular build (esbuild) names them
 * `main-<hash>.js`, `chunk-<hash>.js`, `polyfills-<hash>.js` and `styles-<hash>.css`, the hash
 * 8 characters of base64url; fonts and images it copies go under `media/`. Everything else
 * (index.html, ngsw.json, ngsw-worker.js, the manifest, icons) must be asked for again each time.
 */
export function isHashedAsset(path: string): boolean {
  const name = path.slice(path.lastIndexOf('/') + 1);
  return /^(main|chunk|polyfills|styles)-[0-9A-Za-z_-]{8}\.(js|css)$/.test(name) || path.includes('/media/');
}
