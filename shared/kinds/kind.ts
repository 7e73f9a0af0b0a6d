import type * as z from 'zod';
import type { VerdictView } from '../text/verdict-words';

/**
 * What a study kind says about itself to both sides: its name, its row fields and its own settings. The light
 * half of a kind (no statistics), so the schemas and the client can read it; the analysis, checks and report
 * of a kind are in its server module (server/kinds/<kind>/), its screens in the client's
 * (src/app/features/studies/kinds/<kind>/). The registry is shared/kinds/kinds.ts.
 */
export interface KindMeta {
  /** The stored and API name: 'precision'. */
  kind: string;
  /** In words, on lists and headings: "Precision verification". */
  label: string;
  /** The kind as the report's "Kind of study" line says it, and the document's own title. */
  reportKind: string;
  reportTitle: string;
  /** `results.kind` of the analysis this kind stores. */
  resultKind: string;
  /** 'pair': a comparative and a candidate instrument; 'one': a single instrument. */
  instruments: 'pair' | 'one';
  /** The fields of one row, besides excluded, exclusion reason and note, which every kind has. */
  rowFields: readonly RowField[];
  /** One grid row as the API takes it (zod). */
  row: z.ZodType;
  /**
   * The kind's own settings beyond those every study carries (shared/schemas/study.schema.ts StudySettings),
   * stored in the same JSON object: parsed with their defaults at creation, checked on every change.
   */
  settings?: z.ZodObject;
  /**
   * The overall verdicts its findings can reach, as the archive lists and filters them: a key unique among all
   * kinds, an icon (Material Symbols name), a short word and a sentence; never colour alone.
   */
  verdicts: readonly VerdictView[];
  /** Own settings that are words for people, not inputs of the engine (changing them leaves findings current). */
  recordOnly?: readonly string[];
  /** Own settings a director approves as the plan. */
  planFields?: readonly string[];
}

/**
 * One field of a row. `column`: the specimens table's column that stores it; fields without one are kept in the
 * row's `extra` JSON (a new kind needs no migration).
 */
export interface RowField {
  field: string;
  /** 'result': a measured value, read with the study's decimal mark and kept as typed; 'sex': F or M; 'integer': a whole number ≥ 1. */
  type: 'text' | 'result' | 'integer' | 'sex';
  /** The field in words, as messages and the history name it: "candidate result". */
  words: string;
  column?: 'label' | 'comparative' | 'candidate' | 'value' | 'sex' | 'ageBand';
  /** An included row needs it (results always; text fields when set). */
  required?: boolean;
  /** How file columns that fill it are headed (matched on the header as written); absent: not imported. */
  importHeader?: RegExp;
  /** Empty text is stored as null (true) or '' (false). */
  emptyIsNull?: boolean;
}

