/**
 * Our own keys for flap/gear configurations: lower-case words joined by hyphens. Written with
 * zod's small build (`zod/mini`: the same rules and messages, functions instead of methods) so
 * the public check page, which reads card inputs, carries no full zod; the speed book's content
 * schema and the card inputs schema use this one object.
 */
import * as z from 'zod/mini';

export const configurationKeySchema = z.string({ error: 'Give the configuration key.' }).check(
  z.regex(/^[a-z][a-z0-9]*(-[a-z0-9]+)*$/, 'A configuration key is lower-case letters and digits joined by hyphens, such as landing-flap.'),
  z.maxLength(32, 'A configuration key must be at most 32 characters.'),
);
