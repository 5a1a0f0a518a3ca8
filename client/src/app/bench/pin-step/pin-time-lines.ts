import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { offsetLabel, standardOffsetMinutes, stationDayHour, type StationTimeStandard } from '@shared/domain/station-time';

/** The station's zone and the time standard its observers kept. */
export interface StationClock {
  timeZone: string;
  timeStandard: StationTimeStandard;
}

/**
 * The printed time lines near a picked crossing, by day and hour on the station's clock, each with its UTC
 * instant: one click picks a line. The chosen one is pressed.
 */
@Component({
  selector: 'isl-pin-time-lines',
  template: `
    <p class="caption isl-muted" [id]="captionId">Time lines near the click, {{ clockName() }}</p>
    <div class="lines" role="group" [attr.aria-labelledby]="captionId">
      @for (line of lines(); track line.ms) {
        <button
          type="button"
          class="line"
          [class.is-chosen]="line.ms === chosenMs()"
          [attr.aria-pressed]="line.ms === chosenMs()"
          (click)="chosen.emit(line.ms)"
          data-testid="pin-time-line"
        >
          <span class="station">{{ line.station }}</span>&ngsp;<span class="utc">{{ line.utc }}</span>
        </button>
      }
    </div>
  `,
  styles: `
    .caption { margin: 0; font: var(--mat-sys-body-small); }
    .lines { display: flex; flex-wrap: wrap; gap: 4px; }
    .line {
      display: flex; flex-direction: column; align-items: flex-start; padding: 3px 6px; cursor: pointer;
      border: 1px solid var(--mat-sys-outline-variant); border-radius: 6px; background: var(--mat-sys-surface);
      color: var(--mat-sys-on-surface); font: var(--mat-sys-label-medium);
    }
    .line:focus-visible { outline: 2px solid var(--mat-sys-primary); outline-offset: 1px; }
    .line.is-chosen { border-color: var(--mat-sys-primary); background: var(--mat-sys-primary-container); color: var(--mat-sys-on-primary-container); }
    .utc { font: var(--mat-sys-label-small); opacity: 0.8; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PinTimeLines {
  /** Instants of the time lines, epoch ms, earliest first. */
  readonly linesMs = input.required<readonly number[]>();
  readonly chosenMs = input<number | null>(null);
  readonly clock = input.required<StationClock>();
  readonly chosen = output<number>();

  // One Pin step is on the Bench at a time, so one id is enough.
  protected readonly captionId = 'pin-time-lines-caption';
  private readonly offsetMinutes = computed(() => {
    const first = this.linesMs()[0] ?? Date.now();
    return standardOffsetMinutes(this.clock().timeZone, this.clock().timeStandard, first);
  });
  protected readonly clockName = computed(() =>
    this.clock().timeStandard === 'utc' ? 'in UTC, the station’s time standard' : `in local standard time (${offsetLabel(this.offsetMinutes())})`,
  );
  protected readonly lines = computed(() =>
    this.linesMs().map((ms) => ({ ms, station: stationDayHour(ms, this.offsetMinutes()), utc: `${new Date(ms).toISOString().slice(11, 16)} UTC` })),
  );
}
