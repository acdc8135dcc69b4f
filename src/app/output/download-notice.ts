import { Injectable, inject } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { apiErrorMessage } from '../api/api-error';
import {
  type MyInstrument,
  MyInstruments,
  exportOfInstrument,
} from '../instruments/my-instruments';
import { type ExportSource, Downloads } from './downloads';
import type { ExportFormat } from './export-formats';

/**
 * A download as every screen offers it: the file handed to the browser, then a snack bar with its
 * name and the server's notes, or the server's refusal in its own words.
 */
@Injectable({ providedIn: 'root' })
export class DownloadNotice {
  private readonly downloads = inject(Downloads);
  private readonly snackBar = inject(MatSnackBar);
  private readonly instruments = inject(MyInstruments);

  /** Downloads one format of `source`; never rejects: the outcome is told in the snack bar. */
  async download(
    format: ExportFormat,
    source: ExportSource,
    query: Record<string, string> = {},
  ): Promise<void> {
    try {
      const { name, warnings } = await this.downloads.download(format, source, query);
      if (warnings.length > 0)
        this.snackBar.open(`Downloaded ${name}. ${warnings.join(' ')}`, 'Dismiss');
      else this.snackBar.open(`Downloaded ${name}.`, undefined, { duration: 4000 });
    } catch (error) {
      this.snackBar.open(await apiErrorMessage(error), 'Dismiss');
    }
  }

  /** The instrument's own export of `source`, made with its settings in place of the output block. */
  forInstrument(instrument: MyInstrument, source: ExportSource): Promise<void> {
    const query = this.instruments.downloadQuery(instrument);
    return this.download(exportOfInstrument(instrument), source, query);
  }
}
