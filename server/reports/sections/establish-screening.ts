import { num, orDash, withCi } from '../format';
import type { Layout } from '../layout';
import type { EstablishFindings, StudyReport } from '../report-model';
import { drawTable } from '../table';
import { COLOR } from '../theme';
import { PARTITION_WORDS } from '../words';
import { decimalsOf, stepParagraph, stepWords } from './comparison-data';

/** Outlier screening (flags only) and the Harris & Boyd partition tests with per-subgroup limits. */
export function establishScreening(layout: Layout, report: StudyReport, results: EstablishFindings, flagged: number[]): void {
  const d = decimalsOf(report).stat;
  const screen = results.outlierScreen;
  layout.heading('Outliers and partitions');
  layout.keyValues([
    ['Tukey fences', screen ? `${num(screen.tukey.lowerFence, d)} to ${num(screen.tukey.upperFence, d)}${results.method === 'parametric' ? ' (Box–Cox scale)' : ''}` : '—'],
    ['Flagged rows', flagged.length ? flagged.join(', ') : 'None'],
  ]);
  const partitions = results.partitions ?? [];
  const { notes } = stepWords(report, results);
  if (!partitions.length) {
    layout.paragraph('No partition was tested.');
  }
  partitions.forEach((p, k) => {
    const field = PARTITION_WORDS[p.field] ?? p.field;
    layout.subheading(`Partition by ${field.toLowerCase()} (Harris & Boyd)`);
    layout.paragraph(
      `z = ${num(p.z, 2)} against z* = ${num(p.zCritical, 2)}; SD ratio ${num(p.sdRatio, 2)} against 1.5. ` +
      (p.recommended ? 'Separate intervals are recommended.' : 'One common interval is supported.'),
      { bold: true, color: p.recommended ? COLOR.warm : COLOR.ink },
    );
    drawTable(layout, [
      { header: field, weight: 1.2 }, { header: 'n', weight: 0.6, align: 'right' }, { header: 'Mean', weight: 1, align: 'right' },
      { header: 'SD', weight: 1, align: 'right' }, { header: 'Lower limit', weight: 1, align: 'right' }, { header: 'Upper limit', weight: 1, align: 'right' },
    ], (p.groups ?? []).map((g) => [orDash(g.group), String(g.n), num(g.mean, d), num(g.sd, d), num(g.lower, d), num(g.upper, d)]));
    if (p.intervals?.length) {
      drawTable(layout, [
        { header: `${field}: limits with CIs`, weight: 1.4 }, { header: 'n', weight: 0.5, align: 'right' },
        { header: 'Lower (CI)', weight: 2, align: 'right' }, { header: 'Upper (CI)', weight: 2, align: 'right' },
      ], p.intervals.map((i) => [
        i.group, String(i.n),
        withCi(i.lower, d), withCi(i.upper, d),
      ]));
      p.intervals.forEach((i, g) => (['lower', 'upper'] as const).forEach((end) => {
        const note = notes[`partitions.${k}.intervals.${g}.${end}`];
        if (note) stepParagraph(layout, `${field} ${i.group}, ${end} limit: bootstrap ${note}`);
      }));
    }
  });
}
