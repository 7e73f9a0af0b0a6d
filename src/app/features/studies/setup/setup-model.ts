import type { Analyte, CreateStudyBody, Study, StudyKind, StudySettings, UpdateStudyBody } from '@shared/schemas';
import { StudySettings as SettingsSchema } from '@shared/schemas';
import type { KindMeta } from '@shared/kinds/kind';
import { KIND_METAS, kindMeta } from '@shared/kinds/kinds';
import { formatDecisionLevels, parseDecisionLevels } from '../../admin/analytes/decision-levels';

/**
 * The Setup form's settings as the fields hold them (decision levels as text, numbers possibly empty). A study of a kind
 * with settings of its own (KindMeta.settings) carries those beside them, under their own keys.
 */
export interface SettingsValues extends Omit<StudySettings, 'decisionLevels' | 'decimals' | 'resamples' | 'demingRatio'> {
  decisionLevels: string;
  decimals: number | null;
  resamples: number | null;
  demingRatio: number | null;
}

export interface SetupValues {
  kind: StudyKind;
  title: string;
  purpose: string;
  analyteId: number | null;
  comparativeInstrumentId: number | null;
  candidateInstrumentId: number | null;
  instrumentId: number | null;
  settings: SettingsValues;
}

type InstrumentField = 'comparativeInstrumentId' | 'candidateInstrumentId' | 'instrumentId';

/** The instrument fields a kind uses (its KindMeta says a pair or one); the others are not sent. */
const INSTRUMENT_FIELDS: Record<KindMeta['instruments'], readonly InstrumentField[]> = {
  pair: ['comparativeInstrumentId', 'candidateInstrumentId'],
  one: ['instrumentId'],
};

/** A seed for a new study: 12 random hexadecimal digits, shown so the analysis can be repeated. */
export function randomSeed(random: (bytes: Uint8Array) => Uint8Array = (b) => crypto.getRandomValues(b)): string {
  return Array.from(random(new Uint8Array(6)), (byte) => byte.toString(16).padStart(2, '0')).join('');
}

function settingsValues(settings: StudySettings): SettingsValues {
  return { ...settings, decisionLevels: formatDecisionLevels(settings.decisionLevels) };
}

/** The form's starting values: the study's own, or the defaults of a new study with a fresh seed. */
export function setupValues(study: Study | null, seed: string): SetupValues {
  if (study) {
    return {
      kind: study.kind, title: study.title, purpose: study.purpose, analyteId: study.analyte.id,
      comparativeInstrumentId: study.comparativeInstrument?.id ?? null,
      candidateInstrumentId: study.candidateInstrument?.id ?? null,
      instrumentId: study.instrument?.id ?? null,
      settings: settingsValues(study.settings),
    };
  }
  return {
    // A new study starts as the registry's first kind (shared/kinds/kinds.ts), the method comparison.
    kind: KIND_METAS[0].kind, title: '', purpose: '', analyteId: null,
    comparativeInstrumentId: null, candidateInstrumentId: null, instrumentId: null,
    settings: settingsValues({ ...SettingsSchema.parse({}), seed }),
  };
}

/** What choosing an analyte brings into the settings (each stays editable for this study). */
export function settingsFromAnalyte(analyte: Analyte): Partial<SettingsValues> {
  return {
    unit: analyte.unit,
    decimals: analyte.decimals,
    decisionLevels: formatDecisionLevels(analyte.decisionLevels),
    allowableBiasAbsolute: analyte.allowableBiasAbsolute,
    allowableBiasPercent: analyte.allowableBiasPercent,
    allowableBiasSource: analyte.allowableBiasSource,
  };
}

/**
 * The settings as the API takes them; empty numbers become NaN so the shared schema names the field. A kind's own
 * settings (such as a precision study's materials) travel beside them as the form holds them.
 */
export function settingsBody(values: SettingsValues): StudySettings {
  return {
    ...values,
    decisionLevels: parseDecisionLevels(values.decisionLevels) ?? [Number.NaN],
    decimals: values.decimals ?? Number.NaN,
    resamples: values.resamples ?? Number.NaN,
    demingRatio: values.demingRatio ?? Number.NaN,
    seed: values.seed.trim(),
  };
}

function instruments(values: SetupValues): Partial<Record<InstrumentField, number>> {
  const out: Partial<Record<InstrumentField, number>> = {};
  for (const field of INSTRUMENT_FIELDS[kindMeta(values.kind).instruments]) if (values[field] !== null) out[field] = values[field] as number;
  return out;
}

export function createBody(values: SetupValues): CreateStudyBody {
  return {
    kind: values.kind, title: values.title.trim(), purpose: values.purpose, analyteId: values.analyteId ?? Number.NaN,
    ...instruments(values), settings: settingsBody(values.settings),
  };
}

export function updateBody(values: SetupValues, reason: string): Omit<UpdateStudyBody, 'version'> {
  const body: Omit<UpdateStudyBody, 'version'> = {
    title: values.title.trim(), purpose: values.purpose, analyteId: values.analyteId ?? Number.NaN,
    ...instruments(values), settings: settingsBody(values.settings),
  };
  if (reason.trim() !== '') body.reason = reason.trim();
  return body;
}
