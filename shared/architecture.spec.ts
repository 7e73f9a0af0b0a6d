import { readdirSync, readFileSync } from 'fs';
import { join, relative } from 'path';

/**
 * The layering rules of DEVELOPERS.md, read from the import lines of every TypeScript file, so a new import that
 * breaks one fails here rather than in review.
 */
const root = join(__dirname, '..');

function filesUnder(dir: string): string[] {
  return readdirSync(join(root, dir), { withFileTypes: true }).flatMap((e) => {
    const path = join(dir, e.name);
    if (e.isDirectory()) return e.name === 'node_modules' ? [] : filesUnder(path);
    return e.name.endsWith('.ts') ? [path] : [];
  });
}

/** Each import or export-from specifier of a file (static, dynamic and require), with its line. */
function importsOf(file: string): { line: number; spec: string }[] {
  const out: { line: number; spec: string }[] = [];
  readFileSync(join(root, file), 'utf8').split('\n').forEach((text, i) => {
    for (const m of text.matchAll(/(?:from\s+|import\s*\(\s*|require\s*\(\s*|^import\s+)['"]([^'"]+)['"]/g)) out.push({ line: i + 1, spec: m[1] });
  });
  return out;
}

/** The repository path an import points at ('@shared/x' → 'shared/x'; relative paths resolved; packages as they are). */
function target(file: string, spec: string): string {
  if (spec.startsWith('@shared/')) return `shared/${spec.slice('@shared/'.length)}`;
  if (spec.startsWith('.')) return relative(root, join(root, file, '..', spec));
  return spec;
}

function offending(files: string[], bad: (to: string, spec: string) => boolean): string[] {
  return files.flatMap((f) => importsOf(f).filter(({ spec }) => bad(target(f, spec), spec)).map(({ line, spec }) => `${f}:${line} ${spec}`));
}

describe('layering', () => {
  const sharedFiles = filesUnder('shared');
  const clientFiles = filesUnder('src');

  it('reads the imports it judges (the scan itself works)', () => {
    expect(importsOf('shared/stats/analyze-reportable-range.ts').map((i) => i.spec)).toContain('./reportable-range-words');
    expect(target('src/app/features/review/plan/plan-rows.ts', '../../studies/kinds')).toBe('src/app/features/studies/kinds');
    expect(target('server/kinds/index.ts', '@shared/kinds/kinds')).toBe('shared/kinds/kinds');
  });

  it('keeps the statistics free of the study kinds, the server and the browser: shared/stats imports neither', () => {
    // (a spec may take a kind's invented demo data as its fixture)
    const stats = sharedFiles.filter((f) => f.startsWith('shared/stats/') && !f.endsWith('.spec.ts'));
    expect(stats.length).toBeGreaterThan(30);
    expect(offending(stats, (to) => /^(shared\/kinds|server|src)\//.test(to))).toEqual([]);
  });

  it('keeps shared/ free of the server and the browser', () => {
    expect(offending(sharedFiles, (to) => /^(server|src)\//.test(to))).toEqual([]);
  });

  it('reaches shared/ through the @shared alias from outside it, never by climbing folders', () => {
    const outside = [...clientFiles, ...filesUnder('server'), ...filesUnder('e2e')];
    expect(offending(outside, (to, spec) => spec.startsWith('.') && to.startsWith('shared/'))).toEqual([]);
  });

  it('has no cycle between the studies and the review features: studies never import review', () => {
    const studies = clientFiles.filter((f) => f.startsWith('src/app/features/studies/'));
    expect(studies.length).toBeGreaterThan(50);
    expect(offending(studies, (to) => to.startsWith('src/app/features/review'))).toEqual([]);
  });
});
