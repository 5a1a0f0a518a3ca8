import type { AbstractControl, FormGroupDirective, NgForm } from '@angular/forms';
import type { ErrorStateMatcher } from '@angular/material/core';

/**
 * Marks a field in error only once its form has been submitted, not when the field is merely passed over
 * with Tab: an empty field someone has not yet filled in is not a mistake.
 */
export class ShowOnSubmitErrorStateMatcher implements ErrorStateMatcher {
  isErrorState(control: AbstractControl | null, form: FormGroupDirective | NgForm | null): boolean {
    return !!control?.invalid && !!form?.submitted;
  }
}
