import { computed, Injectable, signal } from '@angular/core';
import type { InkLineDraft, KnotInput, PinInput } from '@shared/api/ink-lines';

export type BenchStep = 'pin' | 'ink';

/** A point in full-resolution scan pixels (the master file's pixel grid). */
export interface ScanPoint {
  xPx: number;
  yPx: number;
}

/**
 * The Bench's working state for one scan: the step, the pins, the knots and the crossing picked for the
 * next pin. Every point is kept in FULL-resolution scan pixels; clicks arrive in preview-image pixels and
 * are scaled up here, because the server registers pins against the master scan.
 */
@Injectable()
export class BenchState {
  private readonly stepValue = signal<BenchStep>('pin');
  private readonly pinList = signal<readonly PinInput[]>([]);
  private readonly knotList = signal<readonly KnotInput[]>([]);
  private readonly pendingCrossing = signal<ScanPoint | null>(null);
  private readonly scanPxPerPreviewPxValue = signal<number | null>(null);

  readonly step = this.stepValue.asReadonly();
  readonly pins = this.pinList.asReadonly();
  readonly knots = this.knotList.asReadonly();
  /** The grid crossing picked in the Pin step, waiting for its time and pressure. */
  readonly pendingPin = this.pendingCrossing.asReadonly();
  /** Full-resolution scan pixels per preview pixel; null until the preview has loaded. */
  readonly scanPxPerPreviewPx = this.scanPxPerPreviewPxValue.asReadonly();
  readonly knotCount = computed(() => this.knotList().length);
  readonly draft = computed<InkLineDraft>(() => ({ pins: [...this.pinList()], knots: [...this.knotList()] }));

  chooseStep(step: BenchStep): void {
    this.stepValue.set(step);
    this.pendingCrossing.set(null);
  }

  /** Records the preview's size against the scan's: scale = scan width / preview natural width. */
  setPreviewWidth(scanWidthPx: number, previewNaturalWidthPx: number): void {
    if (!(scanWidthPx > 0) || !(previewNaturalWidthPx > 0)) throw new Error('scan and preview widths must be positive');
    this.scanPxPerPreviewPxValue.set(scanWidthPx / previewNaturalWidthPx);
  }

  /** Converts a point on the preview image to full-resolution scan pixels. */
  toScanPoint(previewPoint: { x: number; y: number }): ScanPoint {
    const scale = this.scanPxPerPreviewPxValue();
    if (scale === null) throw new Error('the preview size is not known yet');
    return { xPx: previewPoint.x * scale, yPx: previewPoint.y * scale };
  }

  /** A click on the preview: picks the next pin's crossing in the Pin step, adds a knot in the Ink step. */
  pickPoint(previewPoint: { x: number; y: number }): void {
    const point = this.toScanPoint(previewPoint);
    if (this.stepValue() === 'pin') this.pendingCrossing.set(point);
    else this.knotList.update((knots) => [...knots, point]);
  }

  /** Turns the picked crossing into a pin with its printed time (ISO 8601 UTC) and pressure (chart form's unit). */
  savePin(time: string, pressure: number): void {
    const crossing = this.pendingCrossing();
    if (crossing === null) throw new Error('pick a grid crossing first');
    this.pinList.update((pins) => [...pins, { ...crossing, time, pressure }]);
    this.pendingCrossing.set(null);
  }

  cancelPin(): void {
    this.pendingCrossing.set(null);
  }

  deletePin(index: number): void {
    this.pinList.update((pins) => pins.filter((_, i) => i !== index));
  }

  undoKnot(): void {
    this.knotList.update((knots) => knots.slice(0, -1));
  }
}
