import { HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { IntakeApi } from './intake-api';

describe('IntakeApi', () => {
  let api: IntakeApi;
  let controller: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(IntakeApi);
    controller = TestBed.inject(HttpTestingController);
  });

  afterEach(() => controller.verify());

  it('when a batch is created, then its label is posted to the batches path', () => {
    api.createBatch('Box 14, Kestrel Ridge 1931').subscribe();

    const request = controller.expectOne('/api/intake/batches');

    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ label: 'Box 14, Kestrel Ridge 1931' });
    request.flush({});
  });

  it('when a file is sent with only a station, then the multipart body carries the file and that field alone, with progress', () => {
    const file = new File(['II*\u0000'], 'kro-1931-box14-07.tif', { type: 'image/tiff' });
    const types: HttpEventType[] = [];

    api.sendFile('batch 1', file, { stationId: 'st-kro' }).subscribe((event) => types.push(event.type));
    const request = controller.expectOne('/api/intake/batches/batch%201/files');
    request.event({ type: HttpEventType.UploadProgress, loaded: 2, total: 4 });
    request.flush({ fileName: file.name, outcome: 'stored', scans: [] }, { status: 201, statusText: 'Created' });

    const body = request.request.body as FormData;
    expect(request.request.reportProgress).toBe(true);
    expect(body.get('stationId')).toBe('st-kro');
    expect(body.has('chartFormId')).toBe(false);
    expect(body.has('chartStart')).toBe(false);
    expect((body.get('file') as File).name).toBe('kro-1931-box14-07.tif');
    expect(types).toContain(HttpEventType.UploadProgress);
  });

  it('when an inventory is imported, then the CSV text is posted as text/csv', () => {
    const csv = 'file name,station,chart on,chart off,box,folder,notes\nkro-07.tif,KRO,1931-03-02 09:00,1931-03-09 09:00,14,3,\n';

    api.importInventory('batch-1', csv).subscribe();
    const request = controller.expectOne('/api/intake/batches/batch-1/inventory');

    expect(request.request.method).toBe('POST');
    expect(request.request.headers.get('Content-Type')).toBe('text/csv; charset=utf-8');
    expect(request.request.body).toBe(csv);
    request.flush({ matched: [], rowsWithoutFile: [], filesWithoutRow: [] });
  });
});
