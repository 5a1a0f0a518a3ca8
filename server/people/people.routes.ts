import { Router, type Response } from 'express';
import type { Page } from '@shared/api/paging';
import { PEOPLE_SORT_KEYS, type PersonSummary } from '@shared/api/people';
import type { AppDeps } from '../app-deps';
import { requireRoles } from '../auth/require-roles';
import { readPageQuery } from '../http/parse-query';
import * as peopleService from './people.service';

/** Mounted at /api/people behind authenticate. */
export function peopleRoutes({ db }: AppDeps): Router {
  const router = Router();
  router.get('/', requireRoles('admin'), async (req, res: Response<Page<PersonSummary>>) => {
    res.json(await peopleService.listPeople(db, readPageQuery(req.query, PEOPLE_SORT_KEYS)));
  });
  return router;
}
