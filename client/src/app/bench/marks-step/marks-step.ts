import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

import { normalizeInstant } from '@shared/api/parse-instant';
import { BenchState } from '../bench-state';

/** Shows an instant back in the form the fields take. */
function typedForm(iso: string | null): string {
  return iso === null ? '' : `${iso.slice(0, 10)} ${iso.slice(11, 16)}`;
}

/**
 * The Marks step: the time marks on the line (click the foot of each on the scan, then give its true time),
 * chart on and chart off as written on the chart, and check readings of the station barometer. All times UTC.
 */
@Component({
  selector: 'isl-marks-step',
  imports: [DatePipe, DecimalPipe, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  template: `
    <section aria-labelledby="marks-heading">
      <h2 id="marks-heading" class="heading">Marks</h2>
      <p class="isl-muted">Click the foot of each time mark on the pen line, then type the time the observer made it (UTC).</p>
      <ol class="rows" aria-label="Time marks">
        @for (mark of state.timeMarks(); track $index) {
          <li class="row" data-testid="time-mark-row">
            <mat-form-field subscriptSizing="dynamic">
              <mat-label>Mark {{ $index + 1 }} time (UTC)</mat-label>
              <input
                matInput
                [value]="typed(mark.time)"
                (change)="setMarkTime($index, $any($event.target).value)"
                placeholder="2026-03-03 08:00"
                data-testid="time-mark-time"
              />
            </mat-form-field>
            <span class="isl-muted">({{ mark.xPx | number: '1.0-0' }}, {{ mark.yPx | number: '1.0-0' }} px)</span>
            <button mat-icon-button type="button" (click)="state.deleteTimeMark($index)" [attr.aria-label]="'Remove time mark ' + ($index + 1)">
              <mat-icon>delete</mat-icon>
            </button>
          </li>
        }
      </ol>

      <h3 class="subheading">Chart on and chart off</h3>
      <div class="row">
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Chart on (UTC)</mat-label>
          <input matInput [value]="typed(state.chartOn())" (change)="setChartOn($any($event.target).value)" data-testid="chart-on" />
        </mat-form-field>
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Chart off (UTC)</mat-label>
          <input matInput [value]="typed(state.chartOff())" (change)="setChartOff($any($event.target).value)" data-testid="chart-off" />
        </mat-form-field>
      </div>

      <h3 class="subheading">Check readings</h3>
      <form class="row" (submit)="$event.preventDefault(); addReading(readingTime.value, readingPressure.value)">
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Time (UTC)</mat-label>
          <input #readingTime matInput placeholder="2026-03-03 08:00" data-testid="check-time" />
        </mat-form-field>
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Barometer (hPa)</mat-label>
          <input #readingPressure matInput inputmode="decimal" data-testid="check-pressure" />
        </mat-form-field>
        <button mat-stroked-button type="submit" data-testid="check-add">Add</button>
      </form>
      <ul class="rows" aria-label="Check readings">
        @for (reading of state.checkReadings(); track $index) {
          <li class="row" data-testid="check-row">
            {{ reading.time | date: 'yyyy-MM-dd HH:mm' : 'UTC' }} UTC · {{ reading.pressureHpa | number: '1.1-2' }} hPa
            <button mat-icon-button type="button" (click)="state.deleteCheckReading($index)" [attr.aria-label]="'Remove check reading ' + ($index + 1)">
              <mat-icon>delete</mat-icon>
            </button>
          </li>
        }
      </ul>
      @if (problem(); as problem) {
        <p class="isl-inline-error" role="alert" data-testid="marks-problem">{{ problem }}</p>
      }
    </section>
  `,
  styles: `
    .heading { font: var(--mat-sys-title-medium); margin: 0 0 4px; }
    .subheading { font: var(--mat-sys-title-small); margin: 12px 0 4px; }
    .rows { list-style: none; margin: 0; padding: 0; }
    .row { display: flex; flex-wrap: wrap; align-items: center; gap: 6px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MarksStep {
  protected readonly state = inject(BenchState);
  protected readonly problem = signal<string | null>(null);
  protected readonly typed = typedForm;

  /** A typed time: a UTC instant, null for an empty field, undefined (and a message) when unreadable. */
  private read(text: string, what: string): string | null | undefined {
    if (text.trim() === '') return null;
    const iso = normalizeInstant(text);
    if (iso === null) {
      this.problem.set(`${what}: type a UTC time such as 2026-03-03 08:00.`);
      return undefined;
    }
    this.problem.set(null);
    return iso;
  }

  protected setMarkTime(index: number, text: string): void {
    const iso = this.read(text, `Time mark ${index + 1}`);
    if (iso !== undefined) this.state.setTimeMarkTime(index, iso);
  }

  protected setChartOn(text: string): void {
    const iso = this.read(text, 'Chart on');
    if (iso !== undefined) this.state.setChartOnOff(iso, this.state.chartOff());
  }

  protected setChartOff(text: string): void {
    const iso = this.read(text, 'Chart off');
    if (iso !== undefined) this.state.setChartOnOff(this.state.chartOn(), iso);
  }

  protected addReading(timeText: string, pressureText: string): void {
    const time = this.read(timeText, 'Check reading');
    const pressureHpa = Number(pressureText.replace(',', '.'));
    if (time === undefined) return;
    if (time === null || !Number.isFinite(pressureHpa) || pressureText.trim() === '') {
      this.problem.set('Check reading: give both its time (UTC) and the barometer reading in hPa.');
      return;
    }
    this.problem.set(null);
    this.state.addCheckReading({ time, pressureHpa });
  }
}
