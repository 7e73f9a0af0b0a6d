import type { Layout } from '../layout';
import { COLOR } from '../theme';

/** The engine's warnings, each in full. */
export function warningsList(layout: Layout, warnings: string[] | undefined, title = 'Warnings'): void {
  layout.subheading(title);
  if (!warnings?.length) layout.paragraph('None.');
  for (const w of warnings ?? []) layout.paragraph(`•  ${w}`, { color: COLOR.warm }, 0);
}
