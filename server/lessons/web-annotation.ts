import { FRONT_NOTE_KIND_LABELS, type LessonDetail } from '@shared/api/lessons';
import { API, IIIF } from '@shared/api/routes';

/** W3C Web Annotation JSON-LD context and media type (Web Annotation Data Model §3.1, Protocol §3.2). */
export const ANNOTATION_CONTEXT = 'http://www.w3.org/ns/anno.jsonld';
export const ANNOTATION_MEDIA_TYPE = 'application/ld+json; profile="http://www.w3.org/ns/anno.jsonld"';
/** Media Fragments URI 1.0: `xywh=` on an image canvas, `t=clock:` on a timed resource. */
const MEDIA_FRAGMENTS = 'http://www.w3.org/TR/media-frags/';

/**
 * The front notes of a lesson as one AnnotationCollection with a single embedded AnnotationPage. Each note is
 * an Annotation (motivation commenting) whose bodies are its text and its kind (tagging), and whose targets are
 * the station series over its time or span (a `t=clock:` fragment) and, when it has a mark, the IIIF canvas of
 * the scan with an `xywh=` fragment (a point is a 1 × 1 box).
 */
export function buildAnnotationCollection(origin: string, lesson: LessonDetail): Record<string, unknown> {
  const collectionId = `${origin}/api/lessons/${encodeURIComponent(lesson.id)}/annotations`;
  const seriesQuery = new URLSearchParams({ stationId: lesson.stationId, from: lesson.from, to: lesson.to }).toString();
  const seriesId = `${origin}${API.series}?${seriesQuery}`;
  const items = lesson.notes.map((note) => {
    const body: Record<string, unknown>[] = [{ type: 'TextualBody', value: FRONT_NOTE_KIND_LABELS[note.kind], purpose: 'tagging', format: 'text/plain', language: 'en' }];
    if (note.text !== '') body.unshift({ type: 'TextualBody', value: note.text, purpose: 'commenting', format: 'text/plain', language: 'en' });
    const clock = note.endTime === null ? `t=clock:${note.time}` : `t=clock:${note.time},${note.endTime}`;
    const target: Record<string, unknown>[] = [
      { type: 'SpecificResource', source: { id: seriesId, type: 'Dataset', format: 'application/json' }, selector: { type: 'FragmentSelector', conformsTo: MEDIA_FRAGMENTS, value: clock } },
    ];
    if (note.mark) {
      const imageBase = `${origin}${IIIF.imageBase(note.mark.scanId)}`;
      const x = Math.round(note.mark.xPx);
      const y = Math.round(note.mark.yPx);
      const w = note.mark.shape === 'box' ? Math.max(1, Math.round(note.mark.widthPx ?? 1)) : 1;
      const h = note.mark.shape === 'box' ? Math.max(1, Math.round(note.mark.heightPx ?? 1)) : 1;
      target.push({
        type: 'SpecificResource',
        source: { id: `${imageBase}/canvas/1`, type: 'Canvas', partOf: [{ id: `${origin}${IIIF.manifest(note.mark.scanId)}`, type: 'Manifest' }] },
        selector: { type: 'FragmentSelector', conformsTo: MEDIA_FRAGMENTS, value: `xywh=${x},${y},${w},${h}` },
      });
    }
    return {
      id: `${collectionId}/${encodeURIComponent(note.id)}`,
      type: 'Annotation',
      motivation: 'commenting',
      created: lesson.createdAt,
      modified: lesson.updatedAt,
      creator: { type: 'Person', name: lesson.ownerName },
      body,
      target,
    };
  });
  return {
    '@context': ANNOTATION_CONTEXT,
    id: collectionId,
    type: 'AnnotationCollection',
    label: lesson.title,
    total: items.length,
    first: { id: `${collectionId}?page=0`, type: 'AnnotationPage', startIndex: 0, items },
  };
}
