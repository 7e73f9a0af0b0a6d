import type { OutgoingHttpHeaders } from 'node:http';
import type { RequestHandler, Response } from 'express';
import { LRUCache } from 'lru-cache';
import { laboratoryVersionOf } from '../auth/session';
import type { RouteSpec } from './routes';

/**
 * Repeated reads answered from memory, never stale.
 *
 * Each laboratory has a change counter (`laboratory_versions`) that triggers move forward at the commit of
 * every transaction changing a row of that laboratory, in any table an answer can show, whatever code or
 * hand-typed SQL made the change (migration 0012). The counter is read in the same statement as the
 * request's session and account (`readAccountWithSession`), so asking the cache costs no round trip. An
 * answer is kept under (laboratory, counter, user, roles, method and full URL with its query) and served
 * again only to a request that read the same counter.
 *
 * Why that is never stale: a change and its counter's move become visible together, at its commit. A request
 * reads the counter (V) first; everything its handler reads comes after, each statement in READ COMMITTED
 * with a snapshot taken later, so it sees every commit that made the counter V (and perhaps later ones). An
 * answer kept under V is therefore never older than V. A later request served that answer read V too, so
 * no change it could have seen was missing from it: any change committed before its read would have moved
 * the counter past V. (Newer than V is harmless: such a change was committing while the request ran.)
 *
 * Only the routes of `CACHED_READS` are cached: GET routes that only read, whose answer is JSON made from
 * the database and the asker alone (no clock, no process state). Errors, statuses other than 200,
 * streamed answers and answers that set a header besides their content type are never kept.
 */

/** The routes whose answers are kept, and why each may be. */
export const CACHED_READS: readonly { method: RouteSpec['method']; path: string; why: string }[] = [
  { method: 'get', path: '/worklist', why: 'the four lists of studies for this person (their drafts and returns, what they may sign); no clock' },
  { method: 'get', path: '/studies', why: 'a page of summaries; a date filter is the laboratory\'s days from its zone, a row of laboratories' },
  { method: 'get', path: '/studies/:id', why: 'one study with its findings status and mayISign for this person; no clock' },
  { method: 'get', path: '/studies/:id/history', why: 'the study\'s audit events in words; no clock' },
];

interface Kept { body: Buffer; etag: string; contentType: string; laboratoryId: number }

export interface ReadCacheStats { hits: number; misses: number; stored: number; notStored: number }

/**
 * Headers `res.send` writes (the content type is kept with the body, the others are made again). Any other header
 * the handler sets, a cookie included, means the answer is not kept. The session's cookie is written after this
 * check, when the headers go out, for a kept answer as for a fresh one.
 */
const MADE_BY_SEND = new Set(['content-type', 'content-length', 'etag']);

export class ReadCache {
  readonly stats: ReadCacheStats = { hits: 0, misses: 0, stored: 0, notStored: 0 };
  private readonly lru: LRUCache<string, Kept>;
  /** The newest counter seen per laboratory, and the keys kept for it (dropped when the counter moves). */
  private readonly newest = new Map<number, bigint>();
  private readonly keysOf = new Map<number, Set<string>>();

  /** `maxBytes` bounds the bodies, keys and tags kept together; one answer may take at most an eighth. */
  constructor(readonly maxBytes: number) {
    this.lru = new LRUCache<string, Kept>({
      maxSize: maxBytes,
      maxEntrySize: Math.max(1, Math.floor(maxBytes / 8)),
      sizeCalculation: (v, k) => v.body.length + 2 * k.length + v.etag.length + v.contentType.length + 64,
      dispose: (v, k) => this.keysOf.get(v.laboratoryId)?.delete(k),
    });
  }

  /** Bytes kept now (bodies, keys, tags). */
  get size(): number { return this.lru.calculatedSize; }
  get entries(): number { return this.lru.size; }

  /** Answers a GET from memory when the same person asked the same at the same counter; otherwise keeps what the handler answers. */
  readonly middleware: RequestHandler = (req, res, next) => {
    const at = req.method === 'GET' ? laboratoryVersionOf(req) : undefined;
    if (!at || !req.user) return next();
    const version = BigInt(at.version);
    const newest = this.newest.get(at.laboratoryId);
    if (newest === undefined || version > newest) {
      this.forget(at.laboratoryId);
      this.newest.set(at.laboratoryId, version);
    } else if (version < newest) {
      // This request read the counter before a change this process has already seen: answer it afresh, keep nothing.
      this.stats.misses++;
      return next();
    }
    const key = `${at.laboratoryId}|${at.version}|${req.user.id}|${[...req.user.roles].sort().join('+')}|GET ${req.originalUrl}`;
    const kept = this.lru.get(key);
    if (kept) {
      this.stats.hits++;
      res.status(200);
      res.setHeader('Content-Type', kept.contentType);
      res.setHeader('ETag', kept.etag);
      res.send(kept.body);
      return;
    }
    this.stats.misses++;
    this.keep(res, key, at.laboratoryId, version);
    next();
  };

  /** Wraps this response's `send` to keep a 200 JSON answer under `key` (if the counter is still the newest). */
  private keep(res: Response, key: string, laboratoryId: number, version: bigint): void {
    const before = res.getHeaders();
    const send = res.send;
    let seen = false;
    res.send = ((body?: unknown) => {
      if (seen || (typeof body !== 'string' && !Buffer.isBuffer(body))) return send.call(res, body);
      seen = true;
      const contentType = String(res.getHeader('Content-Type') ?? '');
      const keepable = res.statusCode === 200 && /^application\/json\b/i.test(contentType) && onlyMadeBySend(before, res.getHeaders());
      const out = send.call(res, body);
      const etag = res.getHeader('ETag');
      this.store(keepable && typeof etag === 'string', key, { body: Buffer.isBuffer(body) ? body : Buffer.from(body, 'utf8'), etag: etag as string, contentType, laboratoryId }, version);
      return out;
    }) as Response['send'];
  }

  private store(keepable: boolean, key: string, kept: Kept, version: bigint): void {
    if (!keepable || this.newest.get(kept.laboratoryId) !== version) {
      this.stats.notStored++;
      return;
    }
    this.lru.set(key, kept);
    if (!this.lru.has(key)) {
      this.stats.notStored++; // larger than an entry may be
      return;
    }
    let keys = this.keysOf.get(kept.laboratoryId);
    if (!keys) this.keysOf.set(kept.laboratoryId, (keys = new Set()));
    keys.add(key);
    this.stats.stored++;
  }

  /** Drops every answer kept for a laboratory (its counter moved: none of them will be asked for again). */
  private forget(laboratoryId: number): void {
    const keys = this.keysOf.get(laboratoryId);
    if (!keys) return;
    for (const k of [...keys]) this.lru.delete(k);
    this.keysOf.delete(laboratoryId);
  }
}

/** True when the handler set no header but those `res.send` makes (an answer with its own headers is not kept). */
function onlyMadeBySend(before: OutgoingHttpHeaders, after: OutgoingHttpHeaders): boolean {
  for (const [name, value] of Object.entries(after)) {
    if (MADE_BY_SEND.has(name)) continue;
    if (JSON.stringify(before[name]) !== JSON.stringify(value)) return false;
  }
  return Object.keys(before).every((name) => MADE_BY_SEND.has(name) || name in after);
}

/**
 * The route table with the cache in front of the handlers of `CACHED_READS` (after their role guard and
 * their own middleware). Every entry must name exactly one GET route.
 */
export function withReadCache(routes: RouteSpec[], cache: ReadCache | null): RouteSpec[] {
  for (const c of CACHED_READS) {
    const found = routes.filter((r) => r.method === c.method && r.path === c.path);
    if (found.length !== 1 || c.method !== 'get' || found[0].sessionless) throw new Error(`the read cache names ${c.method.toUpperCase()} ${c.path}, which is not one GET route with a session`);
  }
  if (!cache) return routes;
  return routes.map((r) => (CACHED_READS.some((c) => c.method === r.method && c.path === r.path) ? { ...r, before: [...(r.before ?? []), cache.middleware] } : r));
}
