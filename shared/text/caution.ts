/**
 * The decision-support caution, in one place: the findings tab, every findings panel's page, the review page,
 * the study PDF (near the findings and again at the end) and the director's sign-off mail carry these words.
 * (The statistics engine writes its own shorter sentence into stored results, shared/stats/comparison-types.ts
 * CAUTION: that is data a signature binds and a re-check compares, not words a page chooses.)
 */
export const CAUTION =
  "Decision support only. These findings do not by themselves make a verification compliant: final acceptance follows local accreditation rules and the laboratory director's professional judgement. They hold only for the specimen types, measuring range, population and lots studied.";
