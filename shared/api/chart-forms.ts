import type { ChartForm } from '../domain/chart-form';

export interface ChartFormSummary extends ChartForm {
  id: string;
  /** Optimistic-edit counter; send it back with a PATCH. */
  version: number;
  /** Scans catalogued with this form; a form with scans can no longer be edited (409 conflict). */
  scanCount: number;
}

/** Body of POST /api/chart-forms: every ChartForm field (checkChartForm gives the field messages). */
export type ChartFormInput = ChartForm;

/** Body of PATCH /api/chart-forms/:id: any ChartForm fields plus the version last read. */
export type ChartFormPatch = Partial<ChartForm> & { version: number };

export const CHART_FORM_SORT_KEYS = ['name'] as const;
export type ChartFormSortKey = (typeof CHART_FORM_SORT_KEYS)[number];
