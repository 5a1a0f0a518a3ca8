import type { Person } from './auth';

export type PersonSummary = Person & { createdAt: string };

export const PEOPLE_SORT_KEYS = ['email', 'displayName', 'createdAt'] as const;
export type PeopleSortKey = (typeof PEOPLE_SORT_KEYS)[number];
