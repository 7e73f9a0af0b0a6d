import type { ApiIssue } from '@shared/schemas';
import type { PlanGroup } from './plan-form';
import { issuePlace, withoutPath } from './plan-words';

/** Where a refusal's issues went: the reason asked for, the Setup fields it names (in words and as issues), the banner. */
export interface PlacedRefusal {
  reasonAsked: string | null;
  setupIssues: ApiIssue[];
  banner: string;
}

/** Puts each issue of a refusal on the plan's field it names (as the field's `server` error); the rest is said in words. */
export function placeRefusal(form: PlanGroup, message: string, issues: readonly ApiIssue[]): PlacedRefusal {
  const fields = Object.keys(form.controls);
  const words: string[] = [];
  const setupIssues: ApiIssue[] = [];
  let reasonAsked: string | null = null;
  for (const issue of issues) {
    const place = issuePlace(issue, fields);
    if ('reason' in place) {
      reasonAsked = withoutPath(issue.message);
    } else if ('field' in place) {
      const control = form.controls[place.field];
      control.setErrors({ ...control.errors, server: withoutPath(issue.message) });
      control.markAsTouched();
    } else {
      words.push(place.setup);
      setupIssues.push(issue);
    }
  }
  const banner = words.length ? words.join(' ') : reasonAsked ?? (issues.length ? 'Check the marked fields of the plan.' : message);
  return { reasonAsked, setupIssues, banner };
}
