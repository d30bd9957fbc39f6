import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';

/**
 * The fonts of the first screen (sign-in, card check): Roboto 400 and 500 (latin) and the app's
 * subset icon font. The build gives them hashed names under `media/`, so index.html cannot name
 * them; the server finds them once and sends an HTTP `Link: rel=preload` header with index.html
 * (HTML Living Standard, "Link type preload"; RFC 8288 for the header), so a phone fetches
 * them beside the scripts instead of after the first render. `crossorigin` because fonts are
 * always fetched in CORS mode (CSS Fonts Level 4, "Font fetching requirements").
 */
const FIRST_SCREEN_FONTS = [/^roboto-latin-400-normal-[A-Z0-9]+\.woff2$/, /^roboto-latin-500-normal-[A-Z0-9]+\.woff2$/, /^material-symbols-subset-[A-Z0-9]+\.woff2$/];

/** The `Link` header value for the build in `distDir`, or null when it holds none of the fonts. */
export function fontPreloadLinks(distDir: string): string | null {
  const media = join(distDir, 'media');
  if (!existsSync(media)) return null;
  const names = readdirSync(media);
  const links = FIRST_SCREEN_FONTS.flatMap((pattern) => names.filter((name) => pattern.test(name)).slice(0, 1)).map(
    (name) => `</media/${name}>; rel=preload; as=font; type="font/woff2"; crossorigin`,
  );
  return links.length > 0 ? links.join(', ') : null;
}
