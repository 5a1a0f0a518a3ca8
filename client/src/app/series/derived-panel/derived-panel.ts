import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, input, output } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { DERIVED_CAUTION } from '@shared/domain/derived-caution';
import type { PressureTendency } from '@shared/domain/pressure-tendency';
import { TENDENCY_CHARACTERISTIC_WORDS } from '@shared/domain/pressure-tendency-words';
import type { PressureUnit } from '@shared/domain/pressure-units';

import { type SeaLevelAssumptions, seaLevelAssumptionText } from '../plot-math/sea-level-line';
import { formatPressure } from '../plot-math/unit-ticks';

/**
 * Derived quantities of the shown series: reduction to mean sea level (asks for the temperature the archive
 * lacks, says what it assumed) and the three-hour tendency at the picked point, each with its caution.
 */
@Component({
  selector: 'isl-derived-panel',
  imports: [ReactiveFormsModule, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  templateUrl: './derived-panel.html',
  styleUrl: './derived-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DerivedPanel {
  /** The barometer height the reduction would use, m; null when the station has none on record. */
  readonly heightM = input<number | null>(null);
  readonly heightSource = input<'barometer' | 'station'>('barometer');
  /** The applied reduction (the page plots it), or null. */
  readonly seaLevel = input<SeaLevelAssumptions | null>(null);
  /** The tendency at the picked point, 'too_coarse', null (not known) or undefined (no point picked). */
  readonly tendency = input<PressureTendency | 'too_coarse' | null | undefined>(undefined);
  readonly unit = input<PressureUnit>('hPa');
  readonly seaLevelChanged = output<SeaLevelAssumptions | null>();

  protected readonly caution = DERIVED_CAUTION;
  protected readonly form = inject(NonNullableFormBuilder).group({
    temperatureC: [null as number | null, [Validators.required, Validators.min(-60), Validators.max(50)]],
    vapourPressureHpa: [0, [Validators.required, Validators.min(0), Validators.max(60)]],
  });
  protected readonly assumptionText = computed(() => {
    const seaLevel = this.seaLevel();
    return seaLevel ? seaLevelAssumptionText(seaLevel, this.heightSource()) : '';
  });
  protected readonly tendencyText = computed(() => {
    const tendency = this.tendency();
    if (tendency === undefined) return 'Click a point on the plot for the three-hour tendency ending there.';
    if (tendency === 'too_coarse') return 'Zoom in to hourly or finer: a three-hour tendency cannot be read from daily or monthly means.';
    if (tendency === null) return 'The curve is not known across the three hours before this point (a gap, or the record starts).';
    const signed = `${tendency.amountHpa >= 0 ? '+' : '−'}${formatPressure(Math.abs(tendency.amountHpa), this.unit())}`;
    return `${signed} in 3 h; characteristic a = ${tendency.characteristic} (${TENDENCY_CHARACTERISTIC_WORDS[tendency.characteristic]}); group ${tendency.group}.`;
  });

  constructor() {
    const destroyRef = inject(DestroyRef);
    this.form.valueChanges.pipe(takeUntilDestroyed(destroyRef)).subscribe(() => {
      if (this.seaLevel() !== null) this.applySeaLevel();
    });
  }

  protected applySeaLevel(): void {
    const heightM = this.heightM();
    if (this.form.invalid || heightM === null) {
      this.form.markAllAsTouched();
      return;
    }
    const { temperatureC, vapourPressureHpa } = this.form.getRawValue();
    this.seaLevelChanged.emit({ heightM, temperatureC: temperatureC as number, vapourPressureHpa });
  }

  protected clearSeaLevel(): void {
    this.seaLevelChanged.emit(null);
  }
}
