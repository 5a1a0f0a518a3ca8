import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page, PageQuery } from '@shared/api/paging';
import type { Register, RegisterChangeLogEntry } from '@shared/api/register-changes';
import { API } from '@shared/api/routes';

import { toPageParams } from '../core/api/page-params';

const CHANGE_LOG_PATHS: Record<Register, (id: string) => string> = {
  station: API.stationChangeLog,
  instrument: API.instrumentChangeLog,
  chart_form: API.chartFormChangeLog,
  ink_line: API.inkLineChangeLog,
};

/** Reads the registers' change logs (archivists and admins). */
@Injectable({ providedIn: 'root' })
export class RegisterChangesApi {
  private readonly http = inject(HttpClient);

  changeLog(register: Register, recordId: string, query: PageQuery): Observable<Page<RegisterChangeLogEntry>> {
    return this.http.get<Page<RegisterChangeLogEntry>>(CHANGE_LOG_PATHS[register](recordId), { params: toPageParams(query) });
  }
}
