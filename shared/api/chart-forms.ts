import type { ChartForm } from '../domain/chart-form';

export interface ChartFormSummary extends ChartForm {
  id: string;
}

export const CHART_FORM_SORT_KEYS = ['name'] as const;
export type ChartFormSortKey = (typeof CHART_FORM_SORT_KEYS)[number];
