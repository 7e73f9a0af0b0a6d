import type { BoardRequirement, ComponentStudy, DueItem, Release, ReleaseSummary, ReleaseTemplate } from '@shared/schemas';
import { RELEASE_CAUTION } from '@shared/schemas';

/** Invented records of the demo laboratory for the client's release tests, in the API's shapes. */

export function componentStudy(over: Partial<ComponentStudy> = {}): ComponentStudy {
  return {
    id: 41, kind: 'method-comparison', title: 'Glucose: line 2 against line 1', state: 'signed', superseded: false,
    verdict: 'within', verdictWord: 'Within the goal', verdictSentence: 'Bias is within the allowable bias at every decision level.',
    n: 48, signerName: 'Dr Mara Quist', signedAt: '2026-05-04T10:12:00Z', meaning: 'accepted', verificationCode: 'GLU-7Q4M-2K9P',
    contentHash: 'a'.repeat(64), ...over,
  };
}

export function boardRequirement(over: Partial<BoardRequirement> = {}): BoardRequirement {
  return {
    key: 'comparison', label: 'Comparison with the current method', kinds: ['method-comparison'], rule: 'At least 40 patient specimens',
    status: 'missing', study: null, linked: [], waiver: null, ...over,
  };
}

const summary = (over: Partial<ReleaseSummary> = {}): ReleaseSummary => ({
  id: 7, changeType: 'new-system', title: 'Glucose on chemistry line 2', analyte: { id: 3, name: 'Glucose' },
  instrument: { id: 5, name: 'Chemistry line 2' }, reagentLot: 'LOT-24117', state: 'open', met: 1, required: 2,
  signerName: null, signedAt: null, goLiveDate: null, verificationCode: null, createdBy: { id: 8, name: 'Tomas Reyes' },
  createdAt: '2026-05-01T08:00:00Z', updatedAt: '2026-05-04T10:12:00Z', ...over,
});

export function releaseSummary(over: Partial<ReleaseSummary> = {}): ReleaseSummary {
  return summary(over);
}

/** An open release of a new system: the comparison is met, the precision study is missing. */
export function release(over: Partial<Release> = {}): Release {
  const met = componentStudy();
  return {
    ...summary(),
    comparativeInstrument: { id: 4, name: 'Chemistry line 1' },
    note: '',
    version: 3,
    requirements: [
      boardRequirement({ status: 'met', study: met, linked: [met] }),
      boardRequirement({ key: 'precision', label: 'Precision', kinds: ['precision'], rule: '5 days × 5 replicates' }),
    ],
    waivers: [],
    ready: false,
    blockers: ['“Precision” has no signed study and is not waived.'],
    signatures: [],
    due: [],
    reviewReasons: [],
    fromDueItem: null,
    mayISign: { allowed: true, why: 'Any director of the laboratory may sign this release.' },
    caution: RELEASE_CAUTION,
    ...over,
  };
}

export function dueItem(over: Partial<DueItem> = {}): DueItem {
  return {
    id: 12, releaseId: 7, releaseTitle: 'Glucose on chemistry line 2', analyte: { id: 3, name: 'Glucose' },
    instrument: { id: 5, name: 'Chemistry line 2' }, ruleKey: 'yearly-comparison', label: 'Yearly comparison', rule: 'Every 12 months', kinds: [],
    dueDate: '2026-06-01', daysLeft: 20, dueWords: 'due in 20 days', state: 'open', status: 'due-soon', startedRelease: null, startedStudy: null, version: 1, ...over,
  };
}

export function templates(): ReleaseTemplate[] {
  return [
    {
      changeType: 'new-system', label: 'New measuring system', version: 2, updatedAt: '2026-04-01T09:00:00Z',
      requirements: [
        { key: 'comparison', label: 'Comparison with the current method', kinds: ['method-comparison'], rule: 'At least 40 specimens' },
        { key: 'precision', label: 'Precision', kinds: ['precision'], rule: '' },
      ],
      dueRules: [{ key: 'yearly-comparison', label: 'Yearly comparison', months: 12, rule: '', kinds: ['method-comparison'] }],
    },
    {
      changeType: 'reagent-lot', label: 'New reagent lot', version: 1, updatedAt: null,
      requirements: [{ key: 'lot-comparison', label: 'Lot-to-lot comparison', kinds: ['method-comparison'], rule: '20 specimens' }],
      dueRules: [],
    },
    { changeType: 'relocation', label: 'Relocated instrument', version: 1, updatedAt: null, requirements: [], dueRules: [] },
    { changeType: 'custom', label: 'Other change', version: 1, updatedAt: null, requirements: [], dueRules: [] },
  ];
}
