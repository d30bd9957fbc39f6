import type { z } from 'zod';
import { linkTokenSchema } from '@shared/api/auth';

/** What the address bar of a mailed link says about its token. */
export type LinkTokenReading = { readonly token: string } | { readonly problem: string };

/**
 * The mails put the token in the fragment (`#token=…`), which never reaches a server log;
 * a `?token=` query is read too, for a link someone retyped.
 */
export function readLinkToken(fragment: string | null, queryToken: string | null, schema: z.ZodType<string> = linkTokenSchema): LinkTokenReading {
  const raw = new URLSearchParams(fragment ?? '').get('token') ?? queryToken ?? '';
  const parsed = schema.safeParse(raw.trim());
  return parsed.success ? { token: parsed.data } : { problem: parsed.error.issues[0]?.message ?? 'This link is not valid.' };
}
