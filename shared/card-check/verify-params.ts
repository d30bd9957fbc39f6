/**
 * The path parameter of the public card check API (`verify-api.ts`) as the OpenAPI document
 * describes it. Kept apart, in full zod, so the check page's schemas stay in `zod/mini`.
 */
import * as z from 'zod';

export const verifyCodeParamsSchema = z.object({
  code: z.string().describe('The card code, 9 characters (dashes, spaces and case do not matter)'),
});
