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
  signal,
  viewChild,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { ChartForm } from '@shared/domain/chart-form';
import type OpenSeadragon from 'openseadragon';
import { firstValueFrom } from 'rxjs';

import { ScansApi } from '../../core/api/scans-api';
import { AuthSession } from '../../core/auth/auth-session';
import { ApiError } from '../../core/http/api-error';
import { ChartGridDrawing } from '../../shared/chart-grid-drawing/chart-grid-drawing';
import { gridPaths } from '../../shared/chart-grid-drawing/grid-paths';

const MM_PER_INCH = 25.4;
/** OpenSeadragon event types a grid drag keeps to itself. */
const POINTER_EVENTS = new Set(['pointerdown', 'pointerup', 'pointermove', 'pointercancel', 'click', 'dblclick', 'contextmenu']);
const ZOOM_STEP = 1.5;

/** Where the grid sits on the scan and how big it is, in full-resolution scan pixels. */
export interface GridPlacement {
  xPx: number;
  yPx: number;
  widthPx: number;
  heightPx: number;
}

/** The grid's size in scan pixels at the scan's dpi, centred on the image until it is dragged. */
export function gridSizePx(form: ChartForm, dpi: number): { widthPx: number; heightPx: number } {
  const paths = gridPaths(form, false);
  const pxPerMm = dpi / MM_PER_INCH;
  return { widthPx: paths.widthMm * pxPerMm, heightPx: paths.heightMm * pxPerMm };
}

/**
 * The close view of a scan: zoom and pan through its IIIF info.json with OpenSeadragon (loaded on first use, so only this
 * page's chunk carries it). Tiles travel with the bearer token (loadTilesWithAjax + ajaxHeaders); the
 * viewer's own image buttons are off (they would load images from a prefixUrl the CSP forbids) and
 * Isallo's compact buttons drive it instead. Optionally lays a chart form's grid over the scan, scaled by
 * the scan's dpi and draggable, so a wrong form shows before anyone traces.
 *
 * The host carries data-open="true" once info.json is read and data-tiles-loaded / data-tiles-drawn counts
 * for tests and for the eye of whoever debugs a slow server.
 */
@Component({
  selector: 'isl-close-view',
  imports: [MatButtonModule, MatIconModule, MatTooltipModule, ChartGridDrawing],
  templateUrl: './close-view.html',
  styleUrl: './close-view.scss',
  host: {
    'data-testid': 'close-view',
    '[attr.data-open]': 'isOpen()',
    '[attr.data-tiles-loaded]': 'tilesLoaded()',
    '[attr.data-tiles-drawn]': 'tilesDrawn()',
    '[attr.data-grid-x]': 'placement()?.xPx',
    '[attr.data-grid-y]': 'placement()?.yPx',
  },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CloseView {
  private readonly session = inject(AuthSession);
  private readonly scansApi = inject(ScansApi);

  readonly scanId = input.required<string>();
  /** Form whose grid can be laid over the scan. */
  readonly gridForm = input<ChartForm | null>(null);
  readonly dpi = input<number | null>(null);
  readonly showGrid = input(false);
  /** What the scan is, for the viewer's text alternative (the file name). */
  readonly scanName = input('');

  private readonly viewerHost = viewChild.required<ElementRef<HTMLDivElement>>('viewerHost');
  private readonly gridHost = viewChild.required<ElementRef<HTMLDivElement>>('gridHost');

  protected readonly isOpen = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly tilesLoaded = signal(0);
  protected readonly tilesDrawn = signal(0);
  /** Drags move the grid (true) or pan the scan under it (false). */
  protected readonly isMovingGrid = signal(true);
  private readonly offset = signal<{ xPx: number; yPx: number } | null>(null);
  private readonly imageSize = signal<{ widthPx: number; heightPx: number } | null>(null);

  protected readonly placement = computed<GridPlacement | null>(() => {
    const form = this.gridForm();
    const dpi = this.dpi();
    const image = this.imageSize();
    if (!this.showGrid() || !form || !dpi || dpi <= 0 || !image) return null;
    const size = gridSizePx(form, dpi);
    const offset = this.offset() ?? { xPx: (image.widthPx - size.widthPx) / 2, yPx: (image.heightPx - size.heightPx) / 2 };
    return { ...size, xPx: Math.round(offset.xPx), yPx: Math.round(offset.yPx) };
  });

  /** The canvas's text alternative: which scan, and whether the grid lies over it. */
  protected readonly altText = computed(() => {
    const name = this.scanName() ? `Scan ${this.scanName()}` : 'The scan';
    const placement = this.placement();
    const form = this.gridForm();
    return placement && form ? `${name} in close view, with the grid of ${form.name} laid over it` : `${name} in close view`;
  });

  private viewer: OpenSeadragon.Viewer | null = null;
  private osd: typeof OpenSeadragon | null = null;
  private gridTracker: OpenSeadragon.MouseTracker | null = null;
  private isGridShown = false;

  constructor() {
    const destroyRef = inject(DestroyRef);
    afterNextRender(() => void this.createViewer(destroyRef));
    effect(() => this.placeGrid(this.placement()));
  }

  zoomIn(): void {
    this.viewer?.viewport.zoomBy(ZOOM_STEP);
  }

  zoomOut(): void {
    this.viewer?.viewport.zoomBy(1 / ZOOM_STEP);
  }

  showWhole(): void {
    this.viewer?.viewport.goHome();
  }

  toggleGridMoving(): void {
    this.isMovingGrid.update((isMoving) => !isMoving);
  }

  /** Puts the grid back in the middle of the scan. */
  recentreGrid(): void {
    this.offset.set(null);
  }

  private async createViewer(destroyRef: DestroyRef): Promise<void> {
    let destroyed = false;
    destroyRef.onDestroy(() => {
      destroyed = true;
      this.gridTracker?.destroy();
      this.viewer?.destroy();
      this.viewer = null;
    });
    let info: Record<string, unknown>;
    let OSD: typeof OpenSeadragon;
    try {
      // OpenSeadragon 5 sends ajaxHeaders with tiles but not with the info.json request of a URL tile
      // source, so the info document comes through HttpClient (token, error mapping) and is handed over.
      [info, OSD] = await Promise.all([firstValueFrom(this.scansApi.iiifInfo(this.scanId())), import('openseadragon').then((m) => m.default)]);
    } catch (error: unknown) {
      // Not a bug of ours to rethrow: the page shows why the image cannot open.
      this.failure.set(error instanceof ApiError ? `The close view could not open the scan: ${error.message}` : 'The close view could not be loaded.');
      return;
    }
    if (destroyed) return;
    this.osd = OSD;
    const token = this.session.token();
    const viewer = OSD({
      element: this.viewerHost().nativeElement,
      tileSources: info,
      loadTilesWithAjax: true,
      ajaxHeaders: token ? { Authorization: `Bearer ${token}` } : {},
      // The canvas drawer reads back cleanly in tests and needs no GPU.
      drawer: 'canvas',
      showNavigationControl: false,
      showNavigator: false,
      showSequenceControl: false,
      visibilityRatio: 0.5,
      minZoomImageRatio: 0.5,
      maxZoomPixelRatio: 4,
      gestureSettingsMouse: { clickToZoom: false, dblClickToZoom: true },
      crossOriginPolicy: false,
      animationTime: 0.4,
    } as OpenSeadragon.Options);
    viewer.addHandler('open', () => {
      const item = viewer.world.getItemAt(0);
      const size = item?.getContentSize();
      if (size) this.imageSize.set({ widthPx: size.x, heightPx: size.y });
      this.failure.set(null);
      this.isOpen.set(true);
      this.placeGrid(this.placement());
    });
    viewer.addHandler('open-failed', (event) => {
      this.isOpen.set(false);
      this.failure.set(`The close view could not open the scan${event.message ? `: ${event.message}` : '.'}`);
    });
    viewer.addHandler('tile-loaded', () => this.tilesLoaded.update((n) => n + 1));
    viewer.addHandler('tile-drawn', () => this.tilesDrawn.update((n) => n + 1));
    viewer.addHandler('tile-load-failed', (event) => {
      if (this.tilesLoaded() === 0) this.failure.set(`Tiles could not be loaded${event.message ? `: ${event.message}` : '.'}`);
    });
    this.viewer = viewer;
    this.gridTracker = new OSD.MouseTracker({
      element: this.gridHost().nativeElement,
      // Dragging the grid must not pan the scan underneath; the wheel still zooms.
      preProcessEventHandler: (info) => {
        if (POINTER_EVENTS.has(info.eventType)) {
          info.stopPropagation = true;
          info.preventDefault = true;
        }
      },
      dragHandler: (event) => this.dragGrid((event as OpenSeadragon.MouseTrackerEvent & { delta: OpenSeadragon.Point }).delta),
    });
  }

  private dragGrid(deltaScreen: OpenSeadragon.Point): void {
    const viewer = this.viewer;
    const item = viewer?.world.getItemAt(0);
    const placement = this.placement();
    if (!viewer || !item || !placement) return;
    const deltaViewport = viewer.viewport.deltaPointsFromPixels(deltaScreen, true);
    const origin = item.viewportToImageCoordinates(0, 0);
    const moved = item.viewportToImageCoordinates(deltaViewport.x, deltaViewport.y);
    this.offset.set({ xPx: placement.xPx + (moved.x - origin.x), yPx: placement.yPx + (moved.y - origin.y) });
  }

  private placeGrid(placement: GridPlacement | null): void {
    const viewer = this.viewer;
    const OSD = this.osd;
    const item = viewer?.world.getItemAt(0);
    const element = this.gridHost().nativeElement;
    if (!viewer || !OSD || !item || !this.isOpen()) return;
    if (!placement) {
      if (this.isGridShown) viewer.removeOverlay(element);
      this.isGridShown = false;
      return;
    }
    const rect = item.imageToViewportRectangle(placement.xPx, placement.yPx, placement.widthPx, placement.heightPx);
    if (this.isGridShown) viewer.updateOverlay(element, rect);
    else viewer.addOverlay({ element, location: rect });
    this.isGridShown = true;
  }
}
