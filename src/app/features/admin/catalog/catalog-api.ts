import { HttpClient } from '@angular/common/http';
import { inject } from '@angular/core';
import { Observable } from 'rxjs';

/** A catalog route set: GET and POST on `path`, PUT on `path/:id`. */
export abstract class CatalogApi<T, B> {
  private readonly http = inject(HttpClient);
  protected abstract readonly path: string;

  list(): Observable<T[]> {
    return this.http.get<T[]>(this.path);
  }

  create(body: B): Observable<T> {
    return this.http.post<T>(this.path, body);
  }

  update(id: number, body: B): Observable<T> {
    return this.http.put<T>(`${this.path}/${id}`, body);
  }
}
