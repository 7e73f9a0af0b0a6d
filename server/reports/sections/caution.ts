import type { Layout } from '../layout';
import { COLOR } from '../theme';
import { CAUTION } from '../words';

/** The caution, in full, in a box that stands out from the findings around it. */
export function cautionCallout(layout: Layout): void {
  layout.callout(CAUTION, { fill: COLOR.warmSoft, edge: COLOR.warm, title: 'Caution' });
}
