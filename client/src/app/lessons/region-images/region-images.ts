import { DestroyRef } from '@angular/core';
import type { ChartRegion } from '@shared/api/lessons';
import { catchError, forkJoin, map, type Observable, of } from 'rxjs';

/**
 * Object URLs of a passage's region images, fetched through HttpClient (the teacher's routes need the token);
 * the URLs of the previous set are revoked on replace, and the last ones when the owner is destroyed.
 */
export class RegionImages {
  private urls: string[] = [];

  constructor(destroyRef: DestroyRef) {
    destroyRef.onDestroy(() => this.revoke());
  }

  /** Loads every region's image; a region whose image fails is left out (the figure shows its placeholder). */
  load(regions: readonly ChartRegion[], fetch: (imagePath: string) => Observable<Blob>): Observable<Record<number, string>> {
    if (regions.length === 0) return of({});
    return forkJoin(regions.map((region) => fetch(region.imagePath).pipe(catchError(() => of(null))))).pipe(
      map((blobs) => {
        this.revoke();
        const byIndex: Record<number, string> = {};
        blobs.forEach((blob, k) => {
          if (blob === null) return;
          const url = URL.createObjectURL(blob);
          this.urls.push(url);
          byIndex[regions[k].index] = url;
        });
        return byIndex;
      }),
    );
  }

  private revoke(): void {
    for (const url of this.urls) URL.revokeObjectURL(url);
    this.urls = [];
  }
}
