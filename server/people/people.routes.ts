import { Router, type Request, type Response } from 'express';
import type { Page } from '@shared/api/paging';
import { parsePersonPatch, PEOPLE_SORT_KEYS, type PeopleChange, type PersonSummary } from '@shared/api/people';
import type { AppDeps } from '../app-deps';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { AppError, HTTP } from '../errors/app-error';
import { valueOrThrow } from '../http/parse-body';
import { isUuid, readPageQuery } from '../http/parse-query';
import * as peopleService from './people.service';

function personId(req: Request): string {
  const value = req.params['personId'];
  if (!isUuid(value)) throw new AppError(HTTP.notFound, 'person_not_found', 'There is no person with this id.');
  return value;
}

/** Mounted at /api/people behind authenticate; admins only. */
export function peopleRoutes({ db }: AppDeps): Router {
  const router = Router();
  router.use(requireRoles('admin'));
  router.get('/', async (req, res: Response<Page<PersonSummary>>) => {
    res.json(await peopleService.listPeople(db, readPageQuery(req.query, PEOPLE_SORT_KEYS)));
  });
  router.get('/changes', async (req, res: Response<Page<PeopleChange>>) => {
    res.json(await peopleService.listPeopleChanges(db, readPageQuery(req.query, [] as const)));
  });
  router.patch('/:personId', async (req, res: Response<PersonSummary>) => {
    const patch = valueOrThrow(parsePersonPatch(req.body), 'The change to this person has invalid fields.');
    res.json(await peopleService.updatePerson(db, signedInPerson(req.user).id, personId(req), patch));
  });
  return router;
}
