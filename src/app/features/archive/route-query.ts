import { Signal, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { ActivatedRoute, Router } from '@angular/router';
import { map } from 'rxjs';
import { RawParams, routerParams } from './query-params';

/**
 * A page's search as the address bar holds it: read with `parse`, and written back with `go`, every
 * key named so that emptied filters leave the address. Call in a constructor or field initialiser.
 */
export function routeQuery<Q, K extends keyof Q & string>(parse: (params: RawParams) => Partial<Q>, keys: readonly K[]) {
  const route = inject(ActivatedRoute);
  const router = inject(Router);
  const query: Signal<Partial<Q>> = toSignal(
    route.queryParamMap.pipe(map((p) => parse(Object.fromEntries(p.keys.map((k) => [k, p.get(k) ?? undefined]))))),
    { initialValue: {} as Partial<Q> },
  );
  const go = (next: Partial<Q>): void => {
    void router.navigate([], { relativeTo: route, queryParams: routerParams(next, keys) });
  };
  return { query, go };
}
