import { AppError, HTTP } from '../errors/app-error';

/** 409 version_conflict: someone saved the record since the caller read it; details carry the current version. */
export function versionConflict(what: string, currentVersion: number): AppError {
  return new AppError(
    HTTP.conflict,
    'version_conflict',
    `Someone else changed this ${what} since you opened it. Reload it to see their changes, then edit again.`,
    { currentVersion },
  );
}
