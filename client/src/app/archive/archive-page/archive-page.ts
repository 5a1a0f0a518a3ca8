import { ChangeDetectionStrategy, Component, viewChild } from '@angular/core';

import { Catalogue } from '../catalogue/catalogue';
import { UploadPanel } from '../upload-panel/upload-panel';

/** The archivist's area: the upload panel above the catalogue of scans. */
@Component({
  selector: 'isl-archive-page',
  imports: [Catalogue, UploadPanel],
  template: `
    <section class="isl-page">
      <h1 class="title">Archive</h1>
      <isl-upload-panel (stored)="refreshCatalogue()" />
      <isl-catalogue />
    </section>
  `,
  styles: `.title { font: var(--mat-sys-headline-small); margin: 0 0 12px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ArchivePage {
  private readonly catalogue = viewChild.required(Catalogue);

  protected refreshCatalogue(): void {
    this.catalogue().reload();
  }
}
