import { inject, Injectable } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';

/** How long a save's confirmation stays: long enough to read, short enough not to cover the next field. */
const SHOWN_MS = 3000;

/**
 * Says that a save went through ("Station saved."), in a short notice read out politely by screen readers.
 * Without it a form that stays open after saving looks the same whether or not the save happened.
 */
@Injectable({ providedIn: 'root' })
export class SavedNotice {
  private readonly snackBar = inject(MatSnackBar);

  show(message: string): void {
    this.snackBar.open(message, undefined, { duration: SHOWN_MS, politeness: 'polite' });
  }
}
