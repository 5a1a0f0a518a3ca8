import { createHash, randomBytes } from 'node:crypto';
import { API_TOKEN_PREFIX, type ApiTokenCreate, type ApiTokenCreated, type ApiTokenSummary } from '@shared/api/api-tokens';
import type { Page, PageQuery } from '@shared/api/paging';
import type { Db } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import * as apiTokensRepository from './api-tokens.repository';

/** 32 random bytes: 256 bits, as the sign-in secret, so the stored SHA-256 cannot be searched back. */
const TOKEN_BYTES = 32;

export function hashApiToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

export async function createToken(db: Db, personId: string, input: ApiTokenCreate): Promise<ApiTokenCreated> {
  const token = `${API_TOKEN_PREFIX}${randomBytes(TOKEN_BYTES).toString('base64url')}`;
  const summary = await apiTokensRepository.insertToken(db, personId, input.name, hashApiToken(token));
  return { ...summary, token };
}

export async function listTokens(db: Db, personId: string, query: PageQuery): Promise<Page<ApiTokenSummary>> {
  const { items, total } = await apiTokensRepository.listTokens(db, personId, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

export async function revokeToken(db: Db, personId: string, tokenId: string): Promise<ApiTokenSummary> {
  const revoked = await apiTokensRepository.revokeToken(db, personId, tokenId);
  if (!revoked) throw new AppError(HTTP.notFound, 'api_token_not_found', 'You have no API token with this id.');
  return revoked;
}
