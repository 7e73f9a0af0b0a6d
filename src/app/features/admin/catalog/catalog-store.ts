import { Observable } from 'rxjs';
import { CatalogApi } from './catalog-api';
import { ListStore } from './list-store';

/** A ListStore for a catalog that is created and edited whole (analytes, instruments). */
export abstract class CatalogStore<T extends { id: number }, B> extends ListStore<T> {
  protected abstract readonly api: CatalogApi<T, B>;

  protected fetch(): Observable<T[]> {
    return this.api.list();
  }

  create(body: B): Observable<T> {
    return this.save(this.api.create(body));
  }

  update(id: number, body: B): Observable<T> {
    return this.save(this.api.update(id, body));
  }
}
