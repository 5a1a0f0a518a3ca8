import {
  afterNextRender,
  ChangeDetectionStrategy,
  Component,
  computed,
  DestroyRef,
  effect,
  ElementRef,
  inject,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { PinInput } from '@shared/api/ink-lines';
import type { GhostGridLine } from '@shared/domain/ghost-grid';
import Konva from 'konva';

import type { BenchKnot, ScanPoint } from '../bench-state';
import { drawGhostGrid } from './stage-ghost-grid';
import { drawMarks, KNOT_NAME, type KnotEdits } from './stage-marks';
import { fitView, type Size, type ViewTransform, zoomAbout } from './view-transform';

const WHEEL_ZOOM_FACTOR = 1.15;
const BUTTON_ZOOM_FACTOR = 1.25;
// Pointer travel (screen px) below which a press counts as a click rather than a pan.
const CLICK_SLOP_PX = 4;

/**
 * The only Konva code in the app: shows the scan preview with pins and knots, pans by dragging and zooms
 * with the wheel (about the cursor) or the +/- buttons. Emits clicks as preview-image pixels; the Bench
 * scales them to full-resolution scan pixels. The host element `scan-stage` carries the current view as
 * data-view-scale (screen px per FULL-resolution scan px) and data-view-x/-y (screen offset of scan pixel
 * 0,0 from the host's top-left), updated synchronously on every pan and zoom, and data-view-ready="true"
 * once the preview is on the stage and its scale to the scan is known.
 */
@Component({
  selector: 'isl-scan-stage',
  imports: [MatButtonModule, MatIconModule],
  templateUrl: './scan-stage.html',
  styleUrl: './scan-stage.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ScanStage {
  /** Object URL of the preview image. */
  readonly imageUrl = input.required<string>();
  /** Full-resolution scan px per preview px; known once the preview has loaded. */
  readonly scanPxPerPreviewPx = input<number | null>(null);
  readonly pins = input<readonly PinInput[]>([]);
  readonly knots = input<readonly BenchKnot[]>([]);
  readonly pendingPin = input<ScanPoint | null>(null);
  /** The fitted printed grid in scan px (after 3 pins), drawn under the marks; null: none. */
  readonly ghostGrid = input<readonly GhostGridLine[] | null>(null);
  /** Pins (by index) off the others: drawn with a warning ring. */
  readonly outlierPins = input<readonly number[]>([]);
  /** Lift or Bridge: the knot picked as a stretch's first end, ringed; null when none. */
  readonly stretchStart = input<number | null>(null);
  /** Ink step: knots can be dragged to correct them and right-clicked to delete them. */
  readonly areKnotsEditable = input(false);
  /** The preview's natural size, once loaded. */
  readonly previewLoaded = output<Size>();
  /** A click on the image, in preview-image pixels. */
  readonly pointPicked = output<{ x: number; y: number }>();
  /** A knot dragged to a new place (preview-image pixels). */
  readonly knotMoved = output<{ index: number; point: { x: number; y: number } }>();
  /** A knot right-clicked for deletion. */
  readonly knotDeleted = output<number>();

  private readonly konvaHost = viewChild.required<ElementRef<HTMLDivElement>>('konvaHost');
  protected readonly zoomPercent = signal(100);
  /** The canvas's text alternative: what is on the scan so far, for a screen reader (the steps' panels carry the detail). */
  protected readonly altText = computed(() => {
    const pins = this.pins().length;
    const knots = this.knots().length;
    const grid = this.ghostGrid() ? ', the ghost grid the pins give' : '';
    return `The scan, zoomed to ${this.zoomPercent()}%, with ${pins} ${pins === 1 ? 'pin' : 'pins'}${grid} and an ink line of ${knots} ${knots === 1 ? 'knot' : 'knots'}`;
  });

  private stage: Konva.Stage | null = null;
  private imageLayer: Konva.Layer | null = null;
  private ghostLayer: Konva.Layer | null = null;
  private marksLayer: Konva.Layer | null = null;
  private imageSize: Size | null = null;
  private pressStart: { x: number; y: number } | null = null;
  // A preview that loaded before the stage existed.
  private pendingImage: HTMLImageElement | null = null;

  constructor() {
    const destroyRef = inject(DestroyRef);
    afterNextRender(() => this.createStage(destroyRef));
    effect(() => this.loadImage(this.imageUrl()));
    effect(() => this.redrawGhostGrid(this.ghostGrid(), this.scanPxPerPreviewPx()));
    effect(() => {
      // Read every input the marks depend on, so the effect re-runs when any of them changes.
      this.areKnotsEditable();
      this.outlierPins();
      this.stretchStart();
      this.redrawMarks(this.currentMarks());
    });
  }

  zoomIn(): void {
    this.zoomAboutCentre(BUTTON_ZOOM_FACTOR);
  }

  zoomOut(): void {
    this.zoomAboutCentre(1 / BUTTON_ZOOM_FACTOR);
  }

  fitToHost(): void {
    if (!this.stage || !this.imageSize) return;
    this.applyView(fitView(this.imageSize, { width: this.stage.width(), height: this.stage.height() }));
  }

  private createStage(destroyRef: DestroyRef): void {
    const host = this.konvaHost().nativeElement;
    const stage = new Konva.Stage({ container: host, width: host.clientWidth || 800, height: host.clientHeight || 600, draggable: true });
    // The scan never needs hit testing; keeping it out of the hit graph keeps panning smooth on large scans.
    this.imageLayer = new Konva.Layer({ listening: false });
    this.ghostLayer = new Konva.Layer({ listening: false });
    this.marksLayer = new Konva.Layer();
    stage.add(this.imageLayer, this.ghostLayer, this.marksLayer);
    stage.on('pointerdown', () => (this.pressStart = stage.getPointerPosition()));
    stage.on('click tap', (event) => {
      // A click on a knot (or a right-click anywhere) is not a new knot.
      const isOnKnot = event.target !== stage && event.target.hasName(KNOT_NAME);
      const isMainButton = !(event.evt instanceof MouseEvent) || event.evt.button === 0;
      if (!isOnKnot && isMainButton) this.pickAtPointer();
    });
    stage.on('contextmenu', (event) => event.evt.preventDefault());
    stage.on('dragmove dragend', () => this.reportView());
    stage.on('wheel', (event) => this.zoomWithWheel(event.evt));
    this.stage = stage;

    const resizeObserver = new ResizeObserver(() => stage.size({ width: host.clientWidth, height: host.clientHeight }));
    resizeObserver.observe(host);
    destroyRef.onDestroy(() => {
      resizeObserver.disconnect();
      stage.destroy();
      this.stage = null;
    });

    if (this.pendingImage) this.showImage(this.pendingImage);
    this.reportView();
    this.redrawGhostGrid(this.ghostGrid(), this.scanPxPerPreviewPx());
    this.redrawMarks(this.currentMarks());
  }

  /** Draws the ghost grid and says on the host how many lines it has (data-ghost-grid-lines, 0 for none). */
  private redrawGhostGrid(lines: readonly GhostGridLine[] | null, scanPxPerPreviewPx: number | null): void {
    if (!this.ghostLayer || scanPxPerPreviewPx === null) return;
    drawGhostGrid(this.ghostLayer, lines, scanPxPerPreviewPx);
    this.konvaHost().nativeElement.setAttribute('data-ghost-grid-lines', String(lines?.length ?? 0));
  }

  private loadImage(url: string): void {
    const image = new Image();
    image.onload = () => {
      this.previewLoaded.emit({ width: image.naturalWidth, height: image.naturalHeight });
      if (this.stage) this.showImage(image);
      else this.pendingImage = image;
    };
    image.src = url;
  }

  private showImage(image: HTMLImageElement): void {
    this.pendingImage = null;
    this.imageLayer?.destroyChildren();
    this.imageLayer?.add(new Konva.Image({ image, x: 0, y: 0, width: image.naturalWidth, height: image.naturalHeight }));
    this.imageSize = { width: image.naturalWidth, height: image.naturalHeight };
    this.fitToHost();
  }

  private pickAtPointer(): void {
    const stage = this.stage;
    const pointer = stage?.getPointerPosition();
    if (!stage || !pointer || !this.imageSize) return;
    const start = this.pressStart;
    if (start && Math.hypot(pointer.x - start.x, pointer.y - start.y) > CLICK_SLOP_PX) return;
    const point = stage.getRelativePointerPosition();
    if (!point) return;
    const isOnImage = point.x >= 0 && point.y >= 0 && point.x <= this.imageSize.width && point.y <= this.imageSize.height;
    if (isOnImage) this.pointPicked.emit({ x: point.x, y: point.y });
  }

  private zoomWithWheel(event: WheelEvent): void {
    event.preventDefault();
    const pointer = this.stage?.getPointerPosition();
    if (!pointer) return;
    this.applyView(zoomAbout(this.currentView(), pointer, event.deltaY < 0 ? WHEEL_ZOOM_FACTOR : 1 / WHEEL_ZOOM_FACTOR));
  }

  private zoomAboutCentre(factor: number): void {
    if (!this.stage) return;
    this.applyView(zoomAbout(this.currentView(), { x: this.stage.width() / 2, y: this.stage.height() / 2 }, factor));
  }

  private currentView(): ViewTransform {
    const stage = this.stage;
    return stage ? { scale: stage.scaleX(), x: stage.x(), y: stage.y() } : { scale: 1, x: 0, y: 0 };
  }

  private applyView(view: ViewTransform): void {
    this.stage?.scale({ x: view.scale, y: view.scale });
    this.stage?.position({ x: view.x, y: view.y });
    this.reportView();
    // Marks keep a constant screen size, so they are redrawn for the new scale.
    this.redrawMarks(this.currentMarks());
  }

  /** Writes the view to the host's data attributes at once, so a test can read them right after an event. */
  private reportView(): void {
    const view = this.currentView();
    const scanPxPerPreviewPx = this.scanPxPerPreviewPx() ?? 1;
    const host = this.konvaHost().nativeElement;
    host.setAttribute('data-view-scale', String(view.scale / scanPxPerPreviewPx));
    host.setAttribute('data-view-x', String(view.x));
    host.setAttribute('data-view-y', String(view.y));
    // Until the preview is shown and its scale to the scan is known, the numbers above are placeholders.
    host.setAttribute('data-view-ready', String(this.imageSize !== null && this.scanPxPerPreviewPx() !== null));
    this.zoomPercent.set(Math.round((100 * view.scale) / scanPxPerPreviewPx));
  }

  private currentMarks(): { pins: readonly PinInput[]; knots: readonly BenchKnot[]; pendingPin: ScanPoint | null; scale: number | null } {
    return { pins: this.pins(), knots: this.knots(), pendingPin: this.pendingPin(), scale: this.scanPxPerPreviewPx() };
  }

  private readonly knotEdits: KnotEdits = {
    moved: (index, point) => this.knotMoved.emit({ index, point }),
    deleted: (index) => this.knotDeleted.emit(index),
  };

  private redrawMarks(marks: { pins: readonly PinInput[]; knots: readonly BenchKnot[]; pendingPin: ScanPoint | null; scale: number | null }): void {
    if (!this.marksLayer || !this.stage || marks.scale === null) return;
    drawMarks(
      this.marksLayer,
      {
        ...marks,
        scanPxPerPreviewPx: marks.scale,
        screenPxPerPreviewPx: this.stage.scaleX(),
        areKnotsEditable: this.areKnotsEditable(),
        outlierPins: new Set(this.outlierPins()),
        stretchStart: this.stretchStart(),
      },
      this.knotEdits,
    );
    // The scale attribute depends on scanPxPerPreviewPx too, which may just have become known.
    this.reportView();
  }
}
