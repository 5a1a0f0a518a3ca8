import sharp from 'sharp';
import request from 'supertest';
import { API, IIIF } from '@shared/api/routes';
import { createChartForm, createPerson, createStation, type TestPerson } from '../helpers/factories';
import { makePng } from '../helpers/images';
import { makeScannedPdf } from '../helpers/scan-files';
import { clearStorage, createTestContext, type TestContext, truncateTables, waitForDerivatives } from '../helpers/test-app';

function binary(call: request.Test): request.Test {
  return call.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (chunk: Buffer) => chunks.push(chunk));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });
}

// PDF pages are read in a child process and derivatives are made in the background: seconds, not milliseconds.
jest.setTimeout(60_000);

describe('IIIF Image 3.0 and Presentation 3.0', () => {
  let context: TestContext;
  let volunteer: TestPerson;
  let archivist: TestPerson;
  let scanId: string;
  let pdfScanIds: string[];
  let stationName: string;

  const get = (url: string, person: TestPerson = volunteer) => request(context.app).get(url).set('Authorization', `Bearer ${person.token}`);
  const getImage = (url: string) => binary(get(url));

  beforeAll(async () => {
    context = await createTestContext();
    await truncateTables(context.db);
    await clearStorage(context.storage);
    volunteer = await createPerson(context.db, ['volunteer']);
    archivist = await createPerson(context.db, ['archivist']);
    const station = await createStation(context.db, { name: 'Kestrel Ridge' });
    stationName = station.name;
    const form = await createChartForm(context.db);
    const batchId = (await request(context.app).post(API.intakeBatches).set('Authorization', `Bearer ${archivist.token}`).send({ label: 'iiif' })).body.id;
    const upload = await request(context.app)
      .post(API.intakeBatchFiles(batchId))
      .set('Authorization', `Bearer ${archivist.token}`)
      .field('stationId', station.id)
      .field('chartFormId', form.id)
      .field('chartStart', '1931-03-02T08:00Z')
      .attach('file', await makePng(1300, 700), 'kro-1931-w10.png');
    scanId = upload.body.scans[0].id;
    await request(context.app)
      .patch(API.scan(scanId))
      .set('Authorization', `Bearer ${archivist.token}`)
      .send({ version: 1, collection: 'KRO-A', box: '14', folder: '3', observer: 'J. Penhallow', tags: ['gale'] });
    const pdf = await request(context.app).post(API.intakeBatchFiles(batchId)).set('Authorization', `Bearer ${archivist.token}`).attach('file', await makeScannedPdf(2), 'two.pdf');
    pdfScanIds = pdf.body.scans.map((scan: { id: string }) => scan.id);
    await context.startWorker();
    await waitForDerivatives(context.db, [scanId, ...pdfScanIds]);
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when info.json is read, then it has the required properties, level 2, tiles and sizes, as JSON-LD with CORS', async () => {
    const response = await get(IIIF.info(scanId));

    expect(response.status).toBe(200);
    // IIIF Image 3.0 §5.1 (docs/references.md §7): media type application/ld+json with the image context profile.
    expect(response.headers['content-type']).toMatch(/^application\/ld\+json;\s*profile="http:\/\/iiif\.io\/api\/image\/3\/context\.json"/);
    // Level 1 requires cors (docs/references.md §7, compliance).
    expect(response.headers['access-control-allow-origin']).toBe('*');
    const info = JSON.parse(response.text);
    // Required: @context, id (base URI, no trailing slash), type, protocol, profile, width, height (docs/references.md §7).
    expect(info['@context']).toBe('http://iiif.io/api/image/3/context.json');
    // The base is the configured public URL (the test app's PUBLIC_URL), never the request's Host header.
    expect(info.id).toBe(`http://isallo.test/iiif/3/${scanId}`);
    expect(info.type).toBe('ImageService3');
    expect(info.protocol).toBe('http://iiif.io/api/image');
    expect(info.profile).toBe('level2');
    expect([info.width, info.height]).toEqual([1300, 700]);
    expect(info.tiles).toEqual([{ width: 512, height: 512, scaleFactors: [1, 2, 4] }]);
    expect(info.sizes).toEqual([
      { width: 325, height: 175 },
      { width: 650, height: 350 },
      { width: 1300, height: 700 },
    ]);
  });

  it('when the base URI is opened, then it answers 303 to info.json', async () => {
    const response = await get(IIIF.imageBase(scanId)).redirects(0);

    // §3: dereferencing the base URI SHOULD give the info document, RECOMMENDED by 303 (docs/references.md §7).
    expect(response.status).toBe(303);
    expect(response.headers['location']).toBe(IIIF.info(scanId));
  });

  it('when a tile of the pyramid is asked for, then the worker-made tile file is served as it is', async () => {
    const response = await getImage(IIIF.image(scanId, '512,0,512,512', '512,512'));

    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('image/jpeg');
    const row = await context.db.selectFrom('scan').select('sha256').where('id', '=', scanId).executeTakeFirstOrThrow();
    const tilePath = context.storage.pathOf(`${context.storage.derivativesKey(row.sha256, 0)}/tiles/512,0,512,512/512,512/0/default.jpg`);
    expect((response.body as Buffer).equals(await import('node:fs/promises').then((fs) => fs.readFile(tilePath)))).toBe(true);
  });

  it.each([
    // IIIF Image 3.0 §4.1 region and §4.2 size forms (docs/references.md §7), on a 1300 × 700 image.
    ['full', 'max', 1300, 700],
    ['square', 'max', 700, 700],
    ['100,50,400,200', 'max', 400, 200],
    ['1200,600,400,400', 'max', 100, 100],
    ['pct:50,50,50,50', 'max', 650, 350],
    ['full', '650,', 650, 350],
    ['full', ',70', 130, 70],
    ['full', 'pct:10', 130, 70],
    ['full', '!200,200', 200, 108],
    ['full', '300,50', 300, 50],
    ['full', '^2600,', 2600, 1400],
  ])('when region %s and size %s are asked for, then the image is %i × %i', async (region, size, widthPx, heightPx) => {
    const response = await getImage(IIIF.image(scanId, region, size));

    expect(response.status).toBe(200);
    const metadata = await sharp(response.body as Buffer).metadata();
    expect([metadata.width, metadata.height]).toEqual([widthPx, heightPx]);
  });

  it('when rotation 90, gray quality and png are asked for, then the image is turned, grey and a PNG', async () => {
    const response = await getImage(IIIF.image(scanId, 'full', '130,70', '90', 'gray', 'png'));

    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('image/png');
    const metadata = await sharp(response.body as Buffer).metadata();
    expect([metadata.format, metadata.width, metadata.height, metadata.channels]).toEqual(['png', 70, 130, 1]);
  });

  async function cachedFiles(): Promise<string[]> {
    const row = await context.db.selectFrom('scan').select('sha256').where('id', '=', scanId).executeTakeFirstOrThrow();
    const { listFiles } = await import('../helpers/test-app');
    return listFiles(context.storage.pathOf(`cache/iiif/${row.sha256}-p0`));
  }

  it('when an advertised size the worker did not make comes twice, then it is rendered once and the second answer is the cached file', async () => {
    const first = await getImage(IIIF.image(scanId, 'full', '650,350'));
    const second = await getImage(IIIF.image(scanId, 'full', '650,'));

    expect(first.status).toBe(200);
    expect((first.body as Buffer).equals(second.body as Buffer)).toBe(true);
    // 650 × 350 is one of the info.json's sizes (IIIF Image 3.0 §5.6, docs/references.md §7): kept, under its canonical name.
    expect(await cachedFiles()).toContain('full_650,350_0_default.jpg');
  });

  it('when regions, sizes and rotations the info.json does not advertise are asked for, then each is rendered and none is kept on disk', async () => {
    const before = await cachedFiles();
    const urls = [
      IIIF.image(scanId, '10,10,300,300', '150,'),
      IIIF.image(scanId, '11,10,300,300', '150,'),
      IIIF.image(scanId, 'full', '641,'),
      IIIF.image(scanId, 'full', '650,350', '90'),
      IIIF.image(scanId, '0,0,512,512', '512,512', '0', 'gray'),
    ];

    const responses = await Promise.all(urls.map((url) => getImage(url)));

    expect(responses.map((response) => response.status)).toEqual([200, 200, 200, 200, 200]);
    const [, , smaller] = responses;
    expect((await sharp(smaller.body as Buffer).metadata()).width).toBe(641);
    // Finding 3 of issue 13: a distinct request must not add a file, or any volunteer could fill the disk.
    expect(await cachedFiles()).toEqual(before);
  });

  it.each([
    ['region', IIIF.image('SCAN', 'left-half', 'max')],
    ['region', IIIF.image('SCAN', '1400,0,10,10', 'max')],
    ['size', IIIF.image('SCAN', 'full', 'huge')],
    ['size', IIIF.image('SCAN', 'full', '2600,')],
    ['rotation', IIIF.image('SCAN', 'full', 'max', '45')],
    ['quality', IIIF.image('SCAN', 'full', 'max', '0', 'sepia')],
    ['format', IIIF.image('SCAN', 'full', 'max', '0', 'default', 'gif')],
  ])('when the %s parameter is bad, then it answers 400 naming it', async (parameter, url) => {
    const response = await get(url.replace('SCAN', scanId));

    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('bad_request');
    expect(response.body.error.details).toEqual({ parameter });
  });

  it('when a PDF page is asked for, then it is served from the page raster', async () => {
    const response = await getImage(IIIF.image(pdfScanIds[1], 'full', 'max'));

    expect(response.status).toBe(200);
    const metadata = await sharp(response.body as Buffer).metadata();
    expect([metadata.width, metadata.height]).toEqual([150, 75]);
  });

  it('when a manifest is read, then it is Presentation 3.0 with metadata, navDate and a canvas painted by the image service', async () => {
    const response = await get(IIIF.manifest(scanId));

    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toMatch(/^application\/ld\+json;\s*profile="http:\/\/iiif\.io\/api\/presentation\/3\/context\.json"/);
    const manifest = JSON.parse(response.text);
    // Top resource: @context, id, type, label language map, items with ≥1 Canvas (docs/references.md §7, Presentation 3.0).
    expect(manifest['@context']).toBe('http://iiif.io/api/presentation/3/context.json');
    expect(manifest.type).toBe('Manifest');
    expect(manifest.id).toMatch(new RegExp(`/iiif/3/${scanId}/manifest$`));
    expect(manifest.label).toEqual({ en: [`${stationName}, 1931-03-02 08:00 UTC`] });
    // navDate: xsd:dateTime with a zone, UTC Z preferred.
    expect(manifest.navDate).toBe('1931-03-02T08:00:00Z');
    expect(manifest.metadata).toEqual(
      expect.arrayContaining([
        { label: { en: ['Station'] }, value: { none: [stationName] } },
        { label: { en: ['Box'] }, value: { none: ['14'] } },
        { label: { en: ['Observer'] }, value: { none: ['J. Penhallow'] } },
      ]),
    );
    const [canvas] = manifest.items;
    // A Canvas MUST have height and width; painting annotations target it; the body is an Image with an ImageService3.
    expect(canvas).toMatchObject({ type: 'Canvas', width: 1300, height: 700 });
    const [page] = canvas.items;
    expect(page.type).toBe('AnnotationPage');
    const [annotation] = page.items;
    expect(annotation).toMatchObject({ type: 'Annotation', motivation: 'painting', target: canvas.id });
    expect(annotation.body).toMatchObject({ type: 'Image', format: 'image/jpeg', width: 1300, height: 700 });
    expect(annotation.body.service).toEqual([{ id: expect.stringMatching(new RegExp(`/iiif/3/${scanId}$`)), type: 'ImageService3', profile: 'level2' }]);
    // Embedded resources MUST NOT carry @context.
    expect(JSON.stringify(manifest.items)).not.toContain('@context');
  });

  it('when a box collection is read, then it lists the manifests of that box', async () => {
    const response = await get(IIIF.boxCollection('KRO-A', '14'));

    expect(response.status).toBe(200);
    const collection = JSON.parse(response.text);
    expect(collection).toMatchObject({ '@context': 'http://iiif.io/api/presentation/3/context.json', type: 'Collection', label: { en: ['KRO-A, box 14'] } });
    expect(collection.items).toEqual([{ id: expect.stringMatching(new RegExp(`/iiif/3/${scanId}/manifest$`)), type: 'Manifest', label: expect.any(Object) }]);
  });

  it('when a box holds several scans, then the collection lists them in shelf order, folder first', async () => {
    // Page 1 of the PDF sits in folder 2 and page 0 in folder 1: shelf order is by folder before the file's page.
    await context.db.updateTable('scan').set({ collection: 'KRO-A', box: '15', folder: '2' }).where('id', '=', pdfScanIds[1]).execute();
    await context.db.updateTable('scan').set({ collection: 'KRO-A', box: '15', folder: '1' }).where('id', '=', pdfScanIds[0]).execute();

    const response = await get(IIIF.boxCollection('KRO-A', '15'));

    expect(response.status).toBe(200);
    const ids = JSON.parse(response.text).items.map((item: { id: string }) => item.id.split('/').at(-2));
    expect(ids).toEqual([pdfScanIds[0], pdfScanIds[1]]);
  });

  it('when a box has no scans, then its collection is 404', async () => {
    const response = await get(IIIF.boxCollection('KRO-A', '99'));

    expect(response.status).toBe(404);
  });

  it('when a viewer preflights a tile request, then CORS allows the Authorization header without a token', async () => {
    const response = await request(context.app).options(IIIF.info(scanId)).set('Origin', 'http://viewer.example').set('Access-Control-Request-Headers', 'authorization');

    expect(response.status).toBe(204);
    expect(response.headers['access-control-allow-headers']).toMatch(/Authorization/i);
  });

  it('when the scan id is unknown, then info.json is 404 scan_not_found', async () => {
    const response = await get(IIIF.info('00000000-0000-4000-8000-000000000000'));

    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('scan_not_found');
  });
});
