import type { Signature } from '@shared/schemas';
import { analysisToShow, planApprovalOf, signOffOf } from './signatures';

const sig = (id: number, meaning: Signature['meaning'], analysisId: number | null = null): Signature => ({
  id, meaning, meaningWords: meaning, signerName: 'Dr Quist', comment: '', signedAt: '2026-11-30T10:00:00.000Z',
  contentHash: 'a'.repeat(64), verificationCode: 'ABCD-EFGH', pdfSha256: null, analysisId,
});

describe('signatures', () => {
  it('tells the plan approval from the sign-off, taking the latest of each', () => {
    const list = [sig(1, 'plan-approved'), sig(2, 'plan-approved'), sig(3, 'accepted', 88)];
    expect(planApprovalOf(list)?.id).toBe(2);
    expect(signOffOf(list)?.id).toBe(3);
    expect(signOffOf([sig(1, 'plan-approved')])).toBeNull();
    expect(planApprovalOf([])).toBeNull();
  });

  it('shows the signed analysis, else the current one, else the latest', () => {
    const study = { currentAnalysisId: 5, latestAnalysisId: 6 };
    expect(analysisToShow(study, [sig(3, 'not-accepted', 4)])).toBe(4);
    expect(analysisToShow(study, [sig(1, 'plan-approved')])).toBe(5);
    expect(analysisToShow({ currentAnalysisId: null, latestAnalysisId: 6 }, [])).toBe(6);
    expect(analysisToShow({ currentAnalysisId: null, latestAnalysisId: null }, [])).toBeNull();
  });
});
