import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page, PageQuery } from '@shared/api/paging';
import type { PeopleSortKey, PersonSummary } from '@shared/api/people';
import { API } from '@shared/api/routes';

import { toPageParams } from '../core/api/page-params';

@Injectable({ providedIn: 'root' })
export class PeopleApi {
  private readonly http = inject(HttpClient);

  list(query: PageQuery<PeopleSortKey>): Observable<Page<PersonSummary>> {
    return this.http.get<Page<PersonSummary>>(API.people, { params: toPageParams(query) });
  }
}
