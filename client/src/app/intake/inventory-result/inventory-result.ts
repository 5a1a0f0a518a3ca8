import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { InventoryMatch } from '@shared/api/intake';

/**
 * How an inventory matched a batch: rows that found their file, rows without a file (a typo in the CSV or
 * a file not sent yet) and files without a row, each file with a link to fix its scan's metadata by hand.
 */
@Component({
  selector: 'isl-inventory-result',
  imports: [RouterLink, MatIconModule],
  templateUrl: './inventory-result.html',
  styleUrl: './inventory-result.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InventoryResult {
  readonly match = input.required<InventoryMatch>();
}
