/**
 * The fake SMTP server's folder: one `.eml` file per message and `index.json` listing them.
 * The admin's mailbox page and the tests read it through these functions.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

export interface MailboxEntry {
  id: string;
  /** The `.eml` file's name inside the folder. */
  file: string;
  from: string;
  to: string[];
  subject: string;
  /** ISO 8601, when the fake server received it. */
  receivedAt: string;
  text: string;
  links: string[];
}

export const MAILBOX_INDEX = 'index.json';

/** Every message in the folder, oldest first; an empty list when nothing has arrived yet. */
export function readMailbox(dir: string): MailboxEntry[] {
  const index = join(dir, MAILBOX_INDEX);
  if (!existsSync(index)) return [];
  return JSON.parse(readFileSync(index, 'utf8')) as MailboxEntry[];
}

/** The http(s) links of a plain-text body, in order, without trailing punctuation. */
export function findLinks(text: string): string[] {
  return (text.match(/https?:\/\/[^\s<>"]+/g) ?? []).map((link) => link.replace(/[.,;:!?)\]]+$/, ''));
}

/**
 * Waits until a message matching `match` is in the folder (mail is sent after the response,
 * so a test asks for it rather than expecting it at once).
 */
export async function waitForMail(dir: string, match: (entry: MailboxEntry) => boolean, timeoutMs = 5000): Promise<MailboxEntry> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = readMailbox(dir).find(match);
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`No matching message arrived in ${dir} within ${timeoutMs} ms.`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}
