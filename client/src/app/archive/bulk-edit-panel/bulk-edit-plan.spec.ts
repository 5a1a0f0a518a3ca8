import type { ScanSummary } from '@shared/api/scans';

import { scanDetailForTest } from '../../core/api/scan-for-test';
import { type BulkEditChoices, planBulkEdit } from './bulk-edit-plan';

const NONE: BulkEditChoices = { stationId: '', instrumentId: '', chartFormId: '', box: '', addTags: '', fileNamePattern: '' };

function scan(id: string, originalName: string, version = 3): ScanSummary {
  return { ...scanDetailForTest({ version }), id, originalName };
}

describe('planBulkEdit', () => {
  const scans = [scan('a', 'KRO_1931-03-02_w10.png'), scan('b', 'KRO_1931-03-09_w11.png', 5), scan('c', 'cover-sheet.png')];

  it('when a station, box and tags are chosen, then each scan goes with its version and only those fields are set', () => {
    const plan = planBulkEdit(scans, { ...NONE, stationId: 'st-1', box: ' 14 ', addTags: 'gale, torn, gale' });

    expect(plan).toEqual({
      kind: 'ready',
      preview: [],
      input: { scans: [{ id: 'a', version: 3 }, { id: 'b', version: 5 }, { id: 'c', version: 3 }], set: { stationId: 'st-1', box: '14', addTags: ['gale', 'torn'] } },
    });
  });

  it('when a file-name pattern is given, then matching names get their chart start and the others keep theirs, as the preview shows', () => {
    const plan = planBulkEdit(scans, { ...NONE, fileNamePattern: 'KRO_{yyyy}-{MM}-{dd}' });

    expect(plan.preview.map((row) => row.chartStart)).toEqual(['1931-03-02T00:00:00.000Z', '1931-03-09T00:00:00.000Z', null]);
    expect(plan.kind === 'ready' && plan.input.scans).toEqual([
      { id: 'a', version: 3, chartStart: '1931-03-02T00:00:00.000Z' },
      { id: 'b', version: 5, chartStart: '1931-03-09T00:00:00.000Z' },
      { id: 'c', version: 3 },
    ]);
  });

  it('when the pattern is malformed, then the plan says what is wrong and sends nothing', () => {
    expect(planBulkEdit(scans, { ...NONE, box: '14', fileNamePattern: 'KRO_{yyyy}-{MM}' })).toEqual({ kind: 'problem', message: 'The file-name pattern: the pattern needs {dd}.', preview: [] });
  });

  it('when nothing is chosen, or the pattern matches no name and nothing else is set, then there is nothing to apply', () => {
    expect(planBulkEdit(scans, NONE)).toMatchObject({ kind: 'problem', message: 'Choose at least one field to set.' });
    expect(planBulkEdit(scans, { ...NONE, fileNamePattern: 'GLN_{yyyy}{MM}{dd}' })).toMatchObject({ kind: 'problem', message: 'No selected file name matches the pattern, and no other field is set.' });
  });
});
