import type { InkLineDraft, PinInput } from '@shared/api/ink-lines';
import type { ChartForm } from '@shared/domain/chart-form';
import { type RegistrationFit, readingToPixel } from '@shared/domain/registration';

const MS_PER_HOUR = 3_600_000;
/** Scan scale of the synthetic trace: 150 dpi is 150 / 25.4 px per mm. */
const PX_PER_MM = 150 / 25.4;

/**
 * The "true" placement of the chart on the synthetic scan: paper (u right, v up, mm) → pixel (x right, y down),
 * a plain scale and shift with the form's own pen-arm radius.
 */
export function syntheticPlacement(form: ChartForm): RegistrationFit {
  return {
    model: 'affine',
    paperToPixel: [PX_PER_MM, 0, 120, 0, -PX_PER_MM, 40 + (form.pressureMax - form.pressureMin) * form.mmPerUnit * PX_PER_MM, 0, 0, 1],
    penArmRadiusMm: form.penArmRadiusMm,
    isRadiusFitted: false,
    residuals: [],
    rmsHpa: 0,
    rmsMinutes: 0,
  };
}

/** The invented pressure of the synthetic trace at a time: a slow 72-hour swing about 1000 hPa. */
export function syntheticPressureHpa(hours: number): number {
  return 1000 + 12 * Math.sin((2 * Math.PI * hours) / 72);
}

function pinAt(form: ChartForm, chartStartMs: number, hours: number, pressure: number): PinInput {
  const { xPx, yPx } = readingToPixel(form, syntheticPlacement(form), { hours, pressure });
  return { xPx, yPx, time: new Date(chartStartMs + hours * MS_PER_HOUR).toISOString(), pressure };
}

/**
 * A hand-in for an hPa chart form: five pins on printed grid crossings and knots every 10 minutes
 * from `fromHours` to `toHours` along syntheticPressureHpa, all placed by syntheticPlacement.
 */
export function syntheticDraft(form: ChartForm, chartStart: string, fromHours = 2, toHours = 26): InkLineDraft {
  const chartStartMs = Date.parse(chartStart);
  const pins = [
    pinAt(form, chartStartMs, 24, 1040),
    pinAt(form, chartStartMs, 144, 1040),
    pinAt(form, chartStartMs, 144, 960),
    pinAt(form, chartStartMs, 24, 960),
    pinAt(form, chartStartMs, 72, 1000),
  ];
  const knots = [];
  for (let minutes = fromHours * 60; minutes <= toHours * 60; minutes += 10) {
    const hours = minutes / 60;
    knots.push(readingToPixel(form, syntheticPlacement(form), { hours, pressure: syntheticPressureHpa(hours) }));
  }
  return { pins, knots };
}

/** Three pins on one printed pressure line: no registration can be fitted from them. */
export function collinearDraft(form: ChartForm, chartStart: string): InkLineDraft {
  const chartStartMs = Date.parse(chartStart);
  const { knots } = syntheticDraft(form, chartStart);
  return { pins: [pinAt(form, chartStartMs, 24, 1000), pinAt(form, chartStartMs, 72, 1000), pinAt(form, chartStartMs, 120, 1000)], knots };
}

/** Invented errors of the corrected synthetic chart: the drum runs 20 min slow and loses 4 min a day; the pen reads 1.3 hPa high. */
export const SYNTHETIC_ERRORS = { clockSlowMinutes: 20, clockLossMinutesPerDay: 4, instrumentHighHpa: 1.3 } as const;

/**
 * A hand-in of the synthetic chart drawn with SYNTHETIC_ERRORS, with three time marks (their feet on the line and
 * true times) and a check reading at each: once corrected, the series is syntheticPressureHpa at true time.
 */
export function syntheticDraftWithErrors(form: ChartForm, chartStart: string, fromHours = 2, toHours = 40): Required<Omit<InkLineDraft, 'draftVersion' | 'step'>> {
  const chartStartMs = Date.parse(chartStart);
  const { clockSlowMinutes, clockLossMinutesPerDay, instrumentHighHpa } = SYNTHETIC_ERRORS;
  const trueHoursOfChart = (hours: number) => hours + (clockSlowMinutes + (clockLossMinutesPerDay * hours) / 24) / 60;
  const chartHoursOfTrue = (hours: number) => (hours - clockSlowMinutes / 60) / (1 + clockLossMinutesPerDay / (24 * 60));
  const pixelAt = (chartHours: number) =>
    readingToPixel(form, syntheticPlacement(form), { hours: chartHours, pressure: syntheticPressureHpa(trueHoursOfChart(chartHours)) + instrumentHighHpa });
  const { pins } = syntheticDraft(form, chartStart);
  const knots = [];
  for (let minutes = fromHours * 60; minutes <= toHours * 60; minutes += 10) knots.push(pixelAt(minutes / 60));
  const markHours = [8, 20, 32];
  const iso = (hours: number) => new Date(chartStartMs + hours * MS_PER_HOUR).toISOString();
  return {
    pins,
    knots,
    timeMarks: markHours.map((hours) => ({ ...pixelAt(chartHoursOfTrue(hours)), time: iso(hours) })),
    chartOn: null,
    chartOff: null,
    checkReadings: markHours.map((hours) => ({ time: iso(hours), pressureHpa: syntheticPressureHpa(hours) })),
  };
}
