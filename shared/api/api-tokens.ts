import { z } from 'zod';
import { parseWith } from './parse-with';

/** Every API token starts with this, so the server (and a secret scanner) can tell it from a sign-in token. */
export const API_TOKEN_PREFIX = 'isallo_pat_';

export const apiTokenCreateSchema = z.strictObject({
  name: z.string().trim().min(1, 'a token needs a name').max(100, 'a name is at most 100 characters').meta({ description: 'What the token is for, e.g. "laptop: R scripts".' }),
});
export type ApiTokenCreate = z.output<typeof apiTokenCreateSchema>;
export const parseApiTokenCreate = (body: unknown) => parseWith(apiTokenCreateSchema, body);

export const apiTokenSummarySchema = z
  .object({
    id: z.uuid(),
    name: z.string(),
    createdAt: z.string(),
    lastUsedAt: z.string().nullable().meta({ description: 'When the token last opened a route; null if never.' }),
    revokedAt: z.string().nullable(),
  })
  .meta({ id: 'ApiTokenSummary' });
export type ApiTokenSummary = z.infer<typeof apiTokenSummarySchema>;

/** The answer to POST /api/tokens: the only time the token itself is shown. */
export const apiTokenCreatedSchema = apiTokenSummarySchema
  .extend({ token: z.string().meta({ description: 'Send as `Authorization: Bearer <token>`. Shown once; only its hash is kept.' }) })
  .meta({ id: 'ApiTokenCreated' });
export type ApiTokenCreated = z.infer<typeof apiTokenCreatedSchema>;
