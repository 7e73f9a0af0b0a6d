import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { z } from 'zod';
import { ListQuery, listQuery } from './list-query';
import { readQuery } from './query-params';

const Query = z.object({
  q: z.string().optional(),
  sort: z.enum(['title', 'createdAt']).default('createdAt'),
  order: z.enum(['asc', 'desc']).default('desc'),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
});
type Query = z.infer<typeof Query>;
const KEYS = ['q', 'sort', 'order', 'page', 'pageSize'] as const;

const searches: Partial<Query>[] = [];

@Component({ selector: 'app-list-host', template: '' })
class ListHost {
  readonly list: ListQuery<Query> = listQuery({
    parse: (params) => readQuery<Query>(Query.shape, KEYS, params), keys: KEYS, pageSize: 25, sortKey: Query.shape.sort,
    sortDefault: { active: 'createdAt', direction: 'desc' }, search: (query) => searches.push(query),
  });
}

async function open(address: string) {
  searches.length = 0;
  TestBed.configureTestingModule({ providers: [provideRouter([{ path: 'list', component: ListHost }])] });
  const harness = await RouterTestingHarness.create();
  const host = await harness.navigateByUrl(address, ListHost);
  await harness.fixture.whenStable();
  const url = () => TestBed.inject(Router).url;
  const settle = () => harness.fixture.whenStable();
  return { list: host.list, url, settle };
}

describe('listQuery', () => {
  it('runs the search the address holds, with the defaults for what it leaves out', async () => {
    const { list } = await open('/list?q=glucose&page=3');
    expect(searches.at(-1)).toEqual({ q: 'glucose', page: 3 });
    expect(list.pageIndex()).toBe(2);
    expect(list.pageSize()).toBe(25);
    expect(list.sort()).toEqual({ active: 'createdAt', direction: 'desc' });
  });

  it('a new search keeps the sort and page size and goes back to the first page', async () => {
    const { list, url, settle } = await open('/list?q=old&sort=title&order=asc&page=4&pageSize=50');
    list.searched({ q: 'new' });
    await settle();
    expect(url()).toBe('/list?q=new&sort=title&order=asc&pageSize=50');
    expect(searches.at(-1)).toEqual({ q: 'new', sort: 'title', order: 'asc', pageSize: 50 });
  });

  it('a sort header click sorts from the first page; no direction or an unknown column means the server’s sort', async () => {
    const { list, url, settle } = await open('/list?q=x&page=2');
    list.sorted({ active: 'title', direction: 'asc' });
    await settle();
    expect(url()).toBe('/list?q=x&sort=title&order=asc');
    expect(list.sort()).toEqual({ active: 'title', direction: 'asc' });
    list.sorted({ active: 'title', direction: '' });
    await settle();
    expect(url()).toBe('/list?q=x');
    list.sorted({ active: 'colour', direction: 'desc' });
    await settle();
    expect(url()).toBe('/list?q=x');
  });

  it('the paginator writes its page, and leaves the usual page size out of the address', async () => {
    const { list, url, settle } = await open('/list?sort=title&order=asc');
    list.paged({ pageIndex: 2, pageSize: 25, length: 100 });
    await settle();
    expect(url()).toBe('/list?sort=title&order=asc&page=3');
    list.paged({ pageIndex: 0, pageSize: 100, length: 100 });
    await settle();
    expect(url()).toBe('/list?sort=title&order=asc&page=1&pageSize=100');
    expect(list.pageSize()).toBe(100);
  });
});
