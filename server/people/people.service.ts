import type { Page, PageQuery } from '@shared/api/paging';
import type { PeopleSortKey, PersonSummary } from '@shared/api/people';
import type { Db } from '../db/database';
import * as peopleRepository from './people.repository';

export async function listPeople(db: Db, query: PageQuery<PeopleSortKey>): Promise<Page<PersonSummary>> {
  const { items, total } = await peopleRepository.listPeople(db, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}
