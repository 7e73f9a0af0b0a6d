import { KIND_METAS } from '@shared/kinds/kinds';
import { KIND_VIEWS, SUPPORTED_KINDS, hasKindView, kindView } from '.';

describe('the client registry of study kinds', () => {
  it('has one view for every kind the shared registry names, in its order', () => {
    expect(KIND_VIEWS.map((v) => v.kind)).toEqual(KIND_METAS.map((m) => m.kind));
    expect(SUPPORTED_KINDS).toEqual(KIND_METAS.map((m) => m.kind));
    for (const meta of KIND_METAS) expect(kindView(meta.kind).kind).toBe(meta.kind);
  });

  it('says in words when a kind has no view, and shows the comparison with the review’s own panels only', () => {
    expect(hasKindView('linearity' as never)).toBe(false);
    expect(() => kindView('linearity' as never)).toThrow('Parallax cannot show a study of kind "linearity" yet.');
    expect(KIND_VIEWS.filter((v) => v.reviewPanel === 'comparison-view').map((v) => v.kind)).toEqual(['method-comparison']);
  });
});
