import type { ScanDetail } from '@shared/api/scans';
import { SCAN_STATUS_LABELS } from '@shared/api/scans';
import { MAX_AREA_PX } from './info-document';

export const PRESENTATION_CONTEXT = 'http://iiif.io/api/presentation/3/context.json';
export const PRESENTATION_MEDIA_TYPE = `application/ld+json;profile="${PRESENTATION_CONTEXT}"`;

type LanguageMap = Record<string, string[]>;
const en = (text: string): LanguageMap => ({ en: [text] });
// Values that are names, codes or times are in no language ("none", Presentation 3.0 §4.1 label).
const none = (text: string): LanguageMap => ({ none: [text] });

/** The label of a scan's manifest: station and chart start, or the file name while those are unknown. */
export function scanLabel(scan: ScanDetail): string {
  const station = scan.stationName ?? 'Unassigned station';
  const when = scan.chartStart ? scan.chartStart.slice(0, 16).replace('T', ' ') + ' UTC' : scan.originalName;
  return scan.pageCount > 1 ? `${station}, ${when} (page ${scan.pageIndex + 1} of ${scan.pageCount})` : `${station}, ${when}`;
}

function metadataOf(scan: ScanDetail): { label: LanguageMap; value: LanguageMap }[] {
  const pairs: [string, string | null | undefined][] = [
    ['Station', scan.stationName],
    ['Chart form', scan.chartFormName],
    ['Instrument', scan.instrumentSerial],
    ['Chart start', scan.chartStart],
    ['Chart on', scan.chartOn],
    ['Chart off', scan.chartOff],
    ['Observer', scan.observer],
    ['Collection', scan.collection],
    ['Box', scan.box],
    ['Folder', scan.folder],
    ['Item', scan.item],
    ['Condition', scan.conditionNotes],
    ['Tags', scan.tags.join(', ')],
    ['Transcription', scan.transcription],
    ['Status', SCAN_STATUS_LABELS[scan.status]],
    ['File name', scan.originalName],
    ['SHA-256', scan.sha256],
    ['Resolution (dpi)', scan.dpi === null ? null : String(scan.dpi)],
  ];
  return pairs.filter(([, value]) => value !== null && value !== undefined && value !== '').map(([label, value]) => ({ label: en(label), value: none(value as string) }));
}

/** Largest size under the image service's maxArea, for the painting body (what `full/max` answers). */
function maxSize(widthPx: number, heightPx: number): { width: number; height: number } {
  const scale = Math.min(1, Math.sqrt(MAX_AREA_PX / (widthPx * heightPx)));
  return { width: Math.max(1, Math.floor(widthPx * scale)), height: Math.max(1, Math.floor(heightPx * scale)) };
}

/**
 * A scan's IIIF Presentation 3.0 Manifest (docs/references.md §7): @context on the top resource only, id and type
 * on every resource, a label language map, one Canvas of the page's pixel size holding one AnnotationPage with
 * a painting Annotation whose Image body carries the ImageService3 service; navDate is the chart start.
 */
export function buildManifest(origin: string, scan: ScanDetail): Record<string, unknown> {
  const imageBase = `${origin}/iiif/3/${encodeURIComponent(scan.id)}`;
  const canvasId = `${imageBase}/canvas/1`;
  const body = maxSize(scan.widthPx, scan.heightPx);
  const manifest: Record<string, unknown> = {
    '@context': PRESENTATION_CONTEXT,
    id: `${imageBase}/manifest`,
    type: 'Manifest',
    label: en(scanLabel(scan)),
    metadata: metadataOf(scan),
    items: [
      {
        id: canvasId,
        type: 'Canvas',
        label: en(scan.pageCount > 1 ? `Page ${scan.pageIndex + 1}` : 'Chart'),
        width: scan.widthPx,
        height: scan.heightPx,
        items: [
          {
            id: `${imageBase}/page/1`,
            type: 'AnnotationPage',
            items: [
              {
                id: `${imageBase}/annotation/1`,
                type: 'Annotation',
                motivation: 'painting',
                body: {
                  id: `${imageBase}/full/max/0/default.jpg`,
                  type: 'Image',
                  format: 'image/jpeg',
                  width: body.width,
                  height: body.height,
                  service: [{ id: imageBase, type: 'ImageService3', profile: 'level2' }],
                },
                target: canvasId,
              },
            ],
          },
        ],
      },
    ],
  };
  // navDate: xsd:dateTime with a zone; ours are ISO 8601 UTC with Z.
  if (scan.chartStart) manifest['navDate'] = scan.chartStart.replace(/\.\d{3}Z$/, 'Z');
  return manifest;
}

/** A Presentation 3.0 Collection of the manifests of one archival box. */
export function buildBoxCollection(origin: string, collection: string, box: string, scans: ScanDetail[]): Record<string, unknown> {
  return {
    '@context': PRESENTATION_CONTEXT,
    id: `${origin}/iiif/collection/box/${encodeURIComponent(collection)}/${encodeURIComponent(box)}`,
    type: 'Collection',
    label: en(`${collection}, box ${box}`),
    metadata: [
      { label: en('Collection'), value: none(collection) },
      { label: en('Box'), value: none(box) },
    ],
    items: scans.map((scan) => ({
      id: `${origin}/iiif/3/${encodeURIComponent(scan.id)}/manifest`,
      type: 'Manifest',
      label: en(scanLabel(scan)),
    })),
  };
}
