import { DestroyRef } from '@angular/core';

/**
 * Holds one object URL at a time for a Blob fetched through HttpClient (so the token was sent),
 * revoking the previous one on replace and the last one when the owner is destroyed.
 */
export class ObjectUrlHolder {
  private current: string | null = null;

  constructor(destroyRef: DestroyRef) {
    destroyRef.onDestroy(() => this.revoke());
  }

  replace(blob: Blob): string {
    this.revoke();
    this.current = URL.createObjectURL(blob);
    return this.current;
  }

  private revoke(): void {
    if (this.current !== null) URL.revokeObjectURL(this.current);
    this.current = null;
  }
}

/** Saves a Blob as a file named fileName through a temporary `<a download>`. */
export function saveBlob(blob: Blob, fileName: string, document: Document): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.rel = 'noopener';
  document.body.appendChild(link);
  link.click();
  link.remove();
  // Revoke after the click has been handled, or some browsers cancel the download.
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
