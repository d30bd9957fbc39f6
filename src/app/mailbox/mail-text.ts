/** A piece of a mail's text: plain words (`href` null), or one of the links the server found in it. */
export interface MailTextPart {
  readonly text: string;
  readonly href: string | null;
}

/**
 * Splits a mail's text around its links. A link to this app under another address (the
 * server's PUBLIC_URL is not always where the browser reached it) opens here instead.
 */
export function splitMailText(text: string, links: readonly string[], appOrigin: string): MailTextPart[] {
  const parts: MailTextPart[] = [];
  let rest = text;
  for (const link of links) {
    const at = rest.indexOf(link);
    if (at < 0) continue;
    if (at > 0) parts.push({ text: rest.slice(0, at), href: null });
    parts.push({ text: link, href: hereIfOurs(link, appOrigin) });
    rest = rest.slice(at + link.length);
  }
  if (rest) parts.push({ text: rest, href: null });
  return parts;
}

function hereIfOurs(link: string, appOrigin: string): string {
  try {
    const url = new URL(link);
    if (url.origin === appOrigin || !/^(localhost|127\.0\.0\.1|\[::1\])$/.test(url.hostname)) return link;
    return `${appOrigin}${url.pathname}${url.search}${url.hash}`;
  } catch {
    return link;
  }
}
