import type { ActivatedRouteSnapshot, RouterStateSnapshot } from '@angular/router';

import { intakeRunningGuard, type SendsFiles } from './intake-running-guard';

function leave(page: SendsFiles): unknown {
  return intakeRunningGuard(page, {} as ActivatedRouteSnapshot, {} as RouterStateSnapshot, {} as RouterStateSnapshot);
}

describe('intakeRunningGuard', () => {
  afterEach(() => jest.restoreAllMocks());

  it('when nothing is being sent, then the archivist leaves without a question', () => {
    const confirm = jest.spyOn(window, 'confirm');

    expect(leave({ isSending: () => false })).toBe(true);
    expect(confirm).not.toHaveBeenCalled();
  });

  it('when files are being sent, then leaving waits for the archivist’s answer', () => {
    jest.spyOn(window, 'confirm').mockReturnValueOnce(false).mockReturnValueOnce(true);

    expect(leave({ isSending: () => true })).toBe(false);
    expect(leave({ isSending: () => true })).toBe(true);
  });
});
