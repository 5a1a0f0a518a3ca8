import { HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { ScansApi } from './scans-api';

describe('ScansApi', () => {
  let api: ScansApi;
  let controller: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(ScansApi);
    controller = TestBed.inject(HttpTestingController);
  });

  afterEach(() => controller.verify());

  it('when a catalogue page is asked for, then page, pageSize, sort, direction and the filters go in the query', () => {
    api.list({ page: 2, pageSize: 50, sort: 'chartStart', direction: 'desc' }, { status: 'ready_to_trace', stationId: 'st-1' }).subscribe();

    const request = controller.expectOne((r) => r.url === '/api/scans');

    expect(request.request.method).toBe('GET');
    expect(request.request.params.get('page')).toBe('2');
    expect(request.request.params.get('pageSize')).toBe('50');
    expect(request.request.params.get('sort')).toBe('chartStart');
    expect(request.request.params.get('direction')).toBe('desc');
    expect(request.request.params.get('status')).toBe('ready_to_trace');
    expect(request.request.params.get('stationId')).toBe('st-1');
  });

  it('when no sort or filter is chosen, then those parameters are left out', () => {
    api.list({ page: 0, pageSize: 25, direction: 'asc' }).subscribe();

    const request = controller.expectOne((r) => r.url === '/api/scans');

    expect(request.request.params.keys().sort()).toEqual(['direction', 'page', 'pageSize']);
  });

  it('when a scan is uploaded, then the fields and the file go as multipart with progress events', () => {
    const file = new File(['not really an image'], 'kro-week-10.png', { type: 'image/png' });
    const eventTypes: HttpEventType[] = [];

    api.upload(file, { stationId: 'st-1', chartFormId: 'cf-1', chartStart: '2026-03-02T00:00:00.000Z' }).subscribe((event) => eventTypes.push(event.type));
    const request = controller.expectOne('/api/scans');
    request.event({ type: HttpEventType.UploadProgress, loaded: 5, total: 10 });
    request.flush({ id: 'scan-1' }, { status: 201, statusText: 'Created' });

    const body = request.request.body as FormData;
    expect(request.request.reportProgress).toBe(true);
    expect(body.get('stationId')).toBe('st-1');
    expect(body.get('chartFormId')).toBe('cf-1');
    expect(body.get('chartStart')).toBe('2026-03-02T00:00:00.000Z');
    expect((body.get('file') as File).name).toBe('kro-week-10.png');
    expect(eventTypes).toContain(HttpEventType.UploadProgress);
    expect(eventTypes).toContain(HttpEventType.Response);
  });

  it('when a preview is fetched, then it is asked for as a blob from the preview path', () => {
    api.preview('scan 1').subscribe();

    const request = controller.expectOne('/api/scans/scan%201/preview');

    expect(request.request.responseType).toBe('blob');
    request.flush(new Blob());
  });

  it('when status counts are asked for with tags, then each tag is its own parameter and no paging is sent', () => {
    api.statusCounts({ tag: ['gale', 'torn'], q: 'box 14' }).subscribe();

    const request = controller.expectOne((r) => r.url === '/api/scans/status-counts');

    expect(request.request.params.getAll('tag')).toEqual(['gale', 'torn']);
    expect(request.request.params.get('q')).toBe('box 14');
    expect(request.request.params.has('page')).toBe(false);
    request.flush({ received: 0, ready_to_trace: 0, traced: 0, approved: 0, withdrawn: 0 });
  });

  it('when catalogue fields are saved, then they go as a PATCH with the version read', () => {
    api.update('scan-1', { version: 4, observer: 'R. Pellow', tags: ['gale'] }).subscribe();

    const request = controller.expectOne('/api/scans/scan-1');

    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ version: 4, observer: 'R. Pellow', tags: ['gale'] });
    request.flush({});
  });

  it('when a scan is withdrawn, then the status and the reason are posted to its status path', () => {
    api.changeStatus('scan-1', { status: 'withdrawn', reason: 'second copy of item 12' }).subscribe();

    const request = controller.expectOne('/api/scans/scan-1/status');

    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ status: 'withdrawn', reason: 'second copy of item 12' });
    request.flush({});
  });

  it('when the Bench asks for its image, then a IIIF request fitted inside the given size is made as a blob', () => {
    api.iiifImage('scan-1', 2400).subscribe();

    const request = controller.expectOne('/iiif/3/scan-1/full/!2400,2400/0/default.jpg');

    expect(request.request.responseType).toBe('blob');
    request.flush(new Blob());
  });
});
