import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

/** The file name a Content-Disposition header gives ("attachment; filename="x.xlsx""), else the fallback. */
export function fileNameFrom(disposition: string | null, fallback: string): string {
  const match = /filename\*?=(?:UTF-8'')?"?([^";]+)"?/i.exec(disposition ?? '');
  const name = match ? decodeURIComponent(match[1].trim()) : '';
  return name && !/[\\/]/.test(name) ? name : fallback;
}

/**
 * Downloads a file through HttpClient, so a refusal reaches the page as an ApiError in words
 * instead of a file of JSON, then hands the bytes to the browser under the server's file name.
 */
@Injectable({ providedIn: 'root' })
export class FileDownload {
  private readonly http = inject(HttpClient);

  /** Emits the saved file's name. */
  save(url: string, fallbackName: string): Observable<string> {
    return this.http.get(url, { observe: 'response', responseType: 'blob' }).pipe(
      map((response) => {
        const name = fileNameFrom(response.headers.get('Content-Disposition'), fallbackName);
        const href = URL.createObjectURL(response.body ?? new Blob());
        const link = document.createElement('a');
        link.href = href;
        link.download = name;
        document.body.appendChild(link);
        link.click();
        link.remove();
        setTimeout(() => URL.revokeObjectURL(href), 10_000);
        return name;
      }),
    );
  }
}
