/**
 * jsdom has no IntersectionObserver, which a `@defer (on viewport)` block sets up: this one never sees the block
 * scrolled into view, so the block stays in its placeholder until a test renders it (DeferBlockBehavior.Manual).
 */
class NeverIntersecting {
  observe(): void {}
  unobserve(): void {}
  disconnect(): void {}
  takeRecords(): [] {
    return [];
  }
}

/** Installs NeverIntersecting for the enclosing describe block and takes it away after it. */
export function withoutViewportEntries(): void {
  beforeAll(() => Object.assign(globalThis, { IntersectionObserver: NeverIntersecting }));
  afterAll(() => delete (globalThis as { IntersectionObserver?: unknown }).IntersectionObserver);
}
