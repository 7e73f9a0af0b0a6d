import { Signal, computed, effect, untracked } from '@angular/core';
import type { PageEvent } from '@angular/material/paginator';
import type { Sort } from '@angular/material/sort';
import type { ZodType } from 'zod';
import { RawParams, withChange } from './query-params';
import { routeQuery } from './route-query';

type Direction = 'asc' | 'desc';

/** The sorting and paging keys of a list the server searches, sorts and pages. */
export interface ListKeys {
  sort?: string;
  order?: Direction;
  page?: number;
  pageSize?: number;
}

export interface ListQueryOptions<Q extends ListKeys, K extends keyof Q & string> {
  /** Reads the address (unknown or refused values leave it). */
  parse: (params: RawParams) => Partial<Q>;
  /** Every key the address may hold. */
  keys: readonly K[];
  /** The page size when the address names none (the address then leaves it out). */
  pageSize: number;
  /** The sort column's schema: a column the server cannot sort by is not put in the address. */
  sortKey: ZodType<NonNullable<Q['sort']>>;
  /** The server's sort when the address names none. */
  sortDefault: { active: NonNullable<Q['sort']>; direction: Direction };
  /** Runs the search in force: at once, and again whenever the address changes. */
  search: (query: Partial<Q>) => void;
}

/** A list page's search, sort and page as the address holds them, with the paginator's and sort header's handlers. */
export interface ListQuery<Q extends ListKeys> {
  /** The search in force. */
  query: Signal<Partial<Q>>;
  pageSize: Signal<number>;
  /** The paginator's page, counted from 0. */
  pageIndex: Signal<number>;
  sort: Signal<{ active: string; direction: Direction }>;
  /** A new search from the filters: sort and page size stay, the list goes back to its first page. */
  searched(fields: Partial<Q>): void;
  /** A sort header was clicked: back to the first page; no direction (or an unknown column) means the server's sort. */
  sorted(sort: Sort): void;
  /** The paginator moved; the usual page size leaves the address. */
  paged(event: PageEvent): void;
  /** Writes a query into the address as it is. */
  go(query: Partial<Q>): void;
}

/**
 * The address plumbing of a list the server searches, sorts and pages (the archive, the releases): the search in force
 * is read from the address and run, and every change (filters, sort, page) is written back to it. Call in a field
 * initialiser or constructor.
 */
export function listQuery<Q extends ListKeys, K extends keyof Q & string>(options: ListQueryOptions<Q, K>): ListQuery<Q> {
  const address = routeQuery<Q, K>(options.parse, options.keys);
  const query = address.query;
  effect(() => {
    const current = query();
    untracked(() => options.search(current));
  });
  return {
    query,
    pageSize: computed(() => query().pageSize ?? options.pageSize),
    pageIndex: computed(() => (query().page ?? 1) - 1),
    sort: computed(() => ({ active: query().sort ?? options.sortDefault.active, direction: query().order ?? options.sortDefault.direction })),
    searched(fields) {
      const { sort, order, pageSize } = query();
      address.go(withChange<Q>({ sort, order, pageSize } as Partial<Q>, fields));
    },
    sorted(sort) {
      const active = options.sortKey.safeParse(sort.active);
      const keep = !!sort.direction && active.success;
      address.go({ ...query(), sort: keep ? active.data : undefined, order: keep ? sort.direction : undefined, page: undefined });
    },
    paged(event) {
      address.go({ ...query(), page: event.pageIndex + 1, pageSize: event.pageSize === options.pageSize ? undefined : event.pageSize });
    },
    go: address.go,
  };
}
