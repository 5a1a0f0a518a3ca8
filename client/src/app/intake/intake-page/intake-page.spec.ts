import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import { scanSummaryForTest } from '../../core/api/scan-for-test';
import { httpErrorInterceptor } from '../../core/http/http-error-interceptor';
import { IntakePage } from './intake-page';

const EMPTY_PAGE = { items: [], total: 0, page: 0, pageSize: 200 };

function settle(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

async function settleMany(): Promise<void> {
  for (let i = 0; i < 10; i++) await settle();
}

function pick(input: HTMLInputElement, files: File[]): void {
  const list = Object.assign(files, { item: (i: number) => files[i] ?? null });
  Object.defineProperty(input, 'files', { value: list, configurable: true });
  input.dispatchEvent(new Event('change'));
}

describe('IntakePage', () => {
  let controller: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([httpErrorInterceptor])), provideHttpClientTesting()],
    });
    controller = TestBed.inject(HttpTestingController);
  });

  function answerLookups(): void {
    for (const r of controller.match((r) => r.url === '/api/stations' || r.url === '/api/chart-forms' || r.url === '/api/intake/batches')) {
      if (r.request.method === 'GET') r.flush(EMPTY_PAGE);
    }
  }

  it('when a folder with scans and an inventory is picked and sent, then a batch is made, the scans go one request each and the CSV stays behind', async () => {
    const fixture = TestBed.createComponent(IntakePage);
    await fixture.whenStable();
    answerLookups();
    const element = fixture.nativeElement as HTMLElement;
    const files = [
      new File(['week 10'], 'kro-w10.png', { type: 'image/png' }),
      new File(['week 11'], 'kro-w11.tif', { type: 'image/tiff' }),
      new File(['file name,station\nkro-w10.png,KRO\n'], 'inventory.csv', { type: 'text/csv' }),
      new File(['x'], '.DS_Store'),
    ];

    pick(element.querySelector<HTMLInputElement>('[data-testid="intake-files"]')!, files);
    await fixture.whenStable();
    const startLabel = element.querySelector('[data-testid="intake-start"]')?.textContent?.trim();
    const inventoryNote = element.querySelector('[data-testid="intake-inventory-found"]')?.textContent;
    element.querySelector<HTMLButtonElement>('[data-testid="intake-start"]')!.click();
    const create = controller.expectOne((r) => r.url === '/api/intake/batches' && r.method === 'POST');
    create.flush({ id: 'batch-1', label: create.request.body.label, createdAt: '2026-12-02T01:00:00Z', createdByName: 'Idris Fenwhistle', fileCount: 0, counts: { stored: 0, duplicate: 0, rejected: 0 }, hasInventory: false });
    await settleMany();
    const sent = controller.match('/api/intake/batches/batch-1/files');

    expect(startLabel).toContain('Send 2 files');
    expect(inventoryNote).toContain('inventory.csv');
    expect(create.request.body.label).toMatch(/^Intake \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC$/);
    expect(sent.map((r) => ((r.request.body as FormData).get('file') as File).name)).toEqual(['kro-w10.png', 'kro-w11.tif']);
    for (const r of sent) {
      const name = ((r.request.body as FormData).get('file') as File).name;
      r.flush({ fileName: name, outcome: 'stored', scans: [scanSummaryForTest({ id: `s-${name}` })] }, { status: 201, statusText: 'Created' });
    }
    await fixture.whenStable();
    expect(element.querySelectorAll('[data-testid="intake-item"][data-state="stored"]')).toHaveLength(2);
    // The summary comes from the server once the last file has its outcome.
    controller.expectOne('/api/intake/batches/batch-1').flush({ id: 'batch-1', label: 'x', createdAt: '2026-12-02T01:00:00Z', createdByName: 'I', fileCount: 2, counts: { stored: 2, duplicate: 0, rejected: 0 }, hasInventory: false, files: [], scans: [] });
    answerLookups();
    fixture.destroy();
  });
});
