import { sql } from 'drizzle-orm';
import {
  bigint, bigserial, boolean, check, customType, doublePrecision, index, integer, json, jsonb, pgTable, primaryKey, serial, text, timestamp, uniqueIndex, varchar,
} from 'drizzle-orm/pg-core';

const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => 'bytea' });
const stamp = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });
const created = () => stamp('created_at').notNull().defaultNow();

/** The tenant. Every other row belongs to one laboratory. */
export const laboratories = pgTable('laboratories', {
  id: serial('id').primaryKey(),
  name: text('name').notNull(),
  timeZone: text('time_zone').notNull().default('UTC'),
  /** A director must approve the plan before specimens can be entered. */
  planApprovalRequired: boolean('plan_approval_required').notNull().default(false),
  /** A one-person laboratory may let a director sign a study whose rows they entered. */
  allowSelfSign: boolean('allow_self_sign').notNull().default(false),
  createdAt: created(),
});

export const users = pgTable('users', {
  id: serial('id').primaryKey(),
  laboratoryId: integer('laboratory_id').notNull().references(() => laboratories.id),
  name: text('name').notNull(),
  email: text('email').notNull(),
  passwordHash: text('password_hash'),
  roles: text('roles').array().notNull(),
  active: boolean('active').notNull().default(true),
  failedSignIns: integer('failed_sign_ins').notNull().default(0),
  lockedUntil: stamp('locked_until'),
  createdAt: created(),
}, (t) => [
  // One account per e-mail among accounts with a password; an invitation not yet taken up may repeat an
  // e-mail that has an account in another laboratory, so inviting it reveals nothing about that laboratory.
  uniqueIndex('users_email_key').on(t.email).where(sql`password_hash IS NOT NULL`),
  uniqueIndex('users_lab_email_key').on(t.laboratoryId, t.email),
]);

/** One-time set-password links (invitations and resets); only the SHA-256 of the token is stored. */
export const passwordLinks = pgTable('password_links', {
  id: serial('id').primaryKey(),
  userId: integer('user_id').notNull().references(() => users.id),
  tokenHash: text('token_hash').notNull(),
  /** 'invitation' (an administrator's new account, 72 hours) or 'reset' (a forgotten password, 1 hour). */
  purpose: text('purpose').notNull().default('invitation'),
  expiresAt: stamp('expires_at').notNull(),
  usedAt: stamp('used_at'),
  createdAt: created(),
}, (t) => [uniqueIndex('password_links_token_key').on(t.tokenHash)]);

export const analytes = pgTable('analytes', {
  id: serial('id').primaryKey(),
  laboratoryId: integer('laboratory_id').notNull().references(() => laboratories.id),
  name: text('name').notNull(),
  unit: text('unit').notNull(),
  decimals: integer('decimals').notNull().default(1),
  decisionLevels: doublePrecision('decision_levels').array().notNull().default(sql`'{}'`),
  allowableBiasAbsolute: doublePrecision('allowable_bias_absolute'),
  allowableBiasPercent: doublePrecision('allowable_bias_percent'),
  allowableBiasSource: text('allowable_bias_source').notNull().default(''),
  canBeNegative: boolean('can_be_negative').notNull().default(false),
  active: boolean('active').notNull().default(true),
  createdAt: created(),
}, (t) => [uniqueIndex('analytes_lab_name_key').on(t.laboratoryId, t.name)]);

export const instruments = pgTable('instruments', {
  id: serial('id').primaryKey(),
  laboratoryId: integer('laboratory_id').notNull().references(() => laboratories.id),
  name: text('name').notNull(),
  model: text('model').notNull().default(''),
  serial: text('serial').notNull().default(''),
  location: text('location').notNull().default(''),
  active: boolean('active').notNull().default(true),
  createdAt: created(),
}, (t) => [uniqueIndex('instruments_lab_name_key').on(t.laboratoryId, t.name)]);

export const studies = pgTable('studies', {
  id: serial('id').primaryKey(),
  laboratoryId: integer('laboratory_id').notNull().references(() => laboratories.id),
  kind: text('kind').notNull(),
  title: text('title').notNull(),
  purpose: text('purpose').notNull().default(''),
  analyteId: integer('analyte_id').notNull().references(() => analytes.id),
  comparativeInstrumentId: integer('comparative_instrument_id').references(() => instruments.id),
  candidateInstrumentId: integer('candidate_instrument_id').references(() => instruments.id),
  instrumentId: integer('instrument_id').references(() => instruments.id),
  settings: jsonb('settings').notNull().default(sql`'{}'::jsonb`),
  state: text('state').notNull().default('draft'),
  version: integer('version').notNull().default(1),
  supersedesId: integer('supersedes_id'),
  supersededById: integer('superseded_by_id'),
  createdBy: integer('created_by').notNull().references(() => users.id),
  createdAt: created(),
  updatedAt: stamp('updated_at').notNull().defaultNow(),
  submittedAt: stamp('submitted_at'),
  signedAt: stamp('signed_at'),
  returnedAt: stamp('returned_at'),
  returnComment: text('return_comment'),
  /** The technologist's note for the director with the submission now awaiting sign-off; cleared on return (the history keeps it). */
  submissionNote: text('submission_note'),
  /** Who submitted the study last. */
  submittedBy: integer('submitted_by').references(() => users.id),
  /** Set when the director approved the plan (a signature with meaning 'plan-approved'). */
  planApprovedAt: stamp('plan_approved_at'),
  /**
   * SHA-256 of the analysed rows and settings (specimens/input-hash.ts), written in the transaction that
   * changes them, so reads compare it with an analysis's hash without loading rows. NULL means "not known":
   * a trigger clears it whenever rows or settings change without it, and the next read computes and stores it.
   */
  inputHash: text('input_hash'),
  /** Included rows, kept with the input hash. */
  includedCount: integer('included_count'),
}, (t) => [
  // The worklist's lists: a laboratory's studies in one state, and one author's, newest first.
  index('studies_lab_state_updated_idx').on(t.laboratoryId, t.state, t.updatedAt),
  index('studies_lab_author_state_idx').on(t.laboratoryId, t.createdBy, t.state, t.updatedAt),
  index('studies_lab_updated_idx').on(t.laboratoryId, t.updatedAt),
]);

export const uploads = pgTable('uploads', {
  id: serial('id').primaryKey(),
  laboratoryId: integer('laboratory_id').notNull().references(() => laboratories.id),
  studyId: integer('study_id').notNull().references(() => studies.id),
  fileName: text('file_name').notNull(),
  mediaType: text('media_type').notNull(),
  size: integer('size').notNull(),
  sha256: text('sha256').notNull(),
  bytes: bytea('bytes').notNull(),
  parsed: jsonb('parsed').notNull(),
  uploadedBy: integer('uploaded_by').notNull().references(() => users.id),
  createdAt: created(),
  importedAt: stamp('imported_at'),
});

export const specimens = pgTable('specimens', {
  id: serial('id').primaryKey(),
  studyId: integer('study_id').notNull().references(() => studies.id),
  position: integer('position').notNull(),
  label: text('label').notNull().default(''),
  comparative: doublePrecision('comparative'),
  candidate: doublePrecision('candidate'),
  value: doublePrecision('value'),
  /** The result as typed or imported, so ties are judged at the reported precision. */
  comparativeText: text('comparative_text'),
  candidateText: text('candidate_text'),
  valueText: text('value_text'),
  sex: text('sex'),
  ageBand: text('age_band'),
  excluded: boolean('excluded').notNull().default(false),
  exclusionReason: text('exclusion_reason'),
  note: text('note').notNull().default(''),
  /** A kind's own row fields that have no column (shared/kinds/kind.ts RowField), e.g. a precision row's material, day and replicate; NULL for kinds without. */
  extra: jsonb('extra').$type<Record<string, string | number | null>>(),
  uploadId: integer('upload_id').references(() => uploads.id),
  enteredBy: integer('entered_by').notNull().references(() => users.id),
}, (t) => [
  index('specimens_study_idx').on(t.studyId, t.position),
  // Results are finite numbers or empty: Infinity and NaN never reach an analysis.
  ...(['comparative', 'candidate', 'value'] as const).map((c) =>
    check(`specimens_${c}_finite`, sql`${t[c]} IS NULL OR (${t[c]} <> 'Infinity'::float8 AND ${t[c]} <> '-Infinity'::float8 AND ${t[c]} <> 'NaN'::float8)`)),
]);

export const analyses = pgTable('analyses', {
  id: serial('id').primaryKey(),
  studyId: integer('study_id').notNull().references(() => studies.id),
  /** 'findings': an analysis of the study's rows; 'plan': a simulation of the planned study before data (its input the plan). */
  purpose: text('purpose').notNull().default('findings'),
  state: text('state').notNull().default('queued'),
  progress: doublePrecision('progress').notNull().default(0),
  inputHash: text('input_hash').notNull(),
  input: jsonb('input').notNull(),
  engineVersion: text('engine_version').notNull(),
  seed: text('seed').notNull(),
  resamples: integer('resamples').notNull(),
  results: jsonb('results'),
  error: text('error'),
  requestedBy: integer('requested_by').notNull().references(() => users.id),
  queuedAt: created(),
  startedAt: stamp('started_at'),
  finishedAt: stamp('finished_at'),
  durationMs: integer('duration_ms'),
  /** 1 for the first run; a run whose process died is queued again once as attempt 2. */
  attempt: integer('attempt').notNull().default(1),
  /** Written every few seconds by the process running it; a stale heartbeat means that process died. */
  heartbeatAt: stamp('heartbeat_at'),
}, (t) => [index('analyses_study_idx').on(t.studyId, t.id), index('analyses_state_idx').on(t.state)]);

export const signatures = pgTable('signatures', {
  id: serial('id').primaryKey(),
  studyId: integer('study_id').notNull().references(() => studies.id),
  analysisId: integer('analysis_id').references(() => analyses.id),
  /** 'plan-approved' before data; 'accepted' or 'not-accepted' at sign-off. */
  meaning: text('meaning').notNull(),
  signerId: integer('signer_id').notNull().references(() => users.id),
  signerName: text('signer_name').notNull(),
  comment: text('comment').notNull().default(''),
  signedAt: stamp('signed_at').notNull().defaultNow(),
  contentHash: text('content_hash').notNull(),
  verificationCode: text('verification_code').notNull(),
  pdf: bytea('pdf'),
  pdfSha256: text('pdf_sha256'),
  /** The laboratory's history chain as it stood when the signature was made: its length and newest event's hash. */
  chainLength: bigint('chain_length', { mode: 'number' }),
  chainHeadHash: text('chain_head_hash'),
});

/** A laboratory's template of a change type: the studies it requires and the re-verification it sets due (server/releases). */
export const releaseTemplates = pgTable('release_templates', {
  id: serial('id').primaryKey(),
  laboratoryId: integer('laboratory_id').notNull().references(() => laboratories.id),
  changeType: text('change_type').notNull(),
  requirements: jsonb('requirements').notNull(),
  dueRules: jsonb('due_rules').notNull(),
  version: integer('version').notNull().default(1),
  updatedBy: integer('updated_by').references(() => users.id),
  updatedAt: stamp('updated_at').notNull().defaultNow(),
}, (t) => [uniqueIndex('release_templates_lab_type_key').on(t.laboratoryId, t.changeType)]);

/** One change to a method: its requirements (copied from the template at creation), state and version. */
export const releases = pgTable('releases', {
  id: serial('id').primaryKey(),
  laboratoryId: integer('laboratory_id').notNull().references(() => laboratories.id),
  changeType: text('change_type').notNull(),
  title: text('title').notNull(),
  analyteId: integer('analyte_id').notNull().references(() => analytes.id),
  instrumentId: integer('instrument_id').notNull().references(() => instruments.id),
  comparativeInstrumentId: integer('comparative_instrument_id').references(() => instruments.id),
  reagentLot: text('reagent_lot').notNull().default(''),
  note: text('note').notNull().default(''),
  requirements: jsonb('requirements').notNull(),
  dueRules: jsonb('due_rules').notNull(),
  /** 'open', 'released', 'not-released', 'needs-review'. */
  state: text('state').notNull().default('open'),
  version: integer('version').notNull().default(1),
  createdBy: integer('created_by').notNull().references(() => users.id),
  createdAt: created(),
  updatedAt: stamp('updated_at').notNull().defaultNow(),
  signedAt: stamp('signed_at'),
}, (t) => [index('releases_lab_state_idx').on(t.laboratoryId, t.state, t.updatedAt)]);

/** A study linked to a release's requirement; a study belongs to at most one release. */
export const releaseStudies = pgTable('release_studies', {
  id: serial('id').primaryKey(),
  laboratoryId: integer('laboratory_id').notNull().references(() => laboratories.id),
  releaseId: integer('release_id').notNull().references(() => releases.id),
  studyId: integer('study_id').notNull().references(() => studies.id),
  requirementKey: text('requirement_key').notNull(),
  linkedBy: integer('linked_by').notNull().references(() => users.id),
  linkedAt: created(),
}, (t) => [uniqueIndex('release_studies_study_key').on(t.studyId), index('release_studies_release_idx').on(t.releaseId)]);

/** A director's waiver of a requirement, with the reason; permanent. */
export const releaseWaivers = pgTable('release_waivers', {
  id: serial('id').primaryKey(),
  laboratoryId: integer('laboratory_id').notNull().references(() => laboratories.id),
  releaseId: integer('release_id').notNull().references(() => releases.id),
  requirementKey: text('requirement_key').notNull(),
  reason: text('reason').notNull(),
  waivedBy: integer('waived_by').notNull().references(() => users.id),
  waivedByName: text('waived_by_name').notNull(),
  waivedAt: stamp('waived_at').notNull().defaultNow(),
}, (t) => [uniqueIndex('release_waivers_req_key').on(t.releaseId, t.requirementKey)]);

/** The director's release signature: meaning, go-live date, the content hash over the component signatures, the PDF; append-only. */
export const releaseSignatures = pgTable('release_signatures', {
  id: serial('id').primaryKey(),
  laboratoryId: integer('laboratory_id').notNull().references(() => laboratories.id),
  releaseId: integer('release_id').notNull().references(() => releases.id),
  meaning: text('meaning').notNull(),
  signerId: integer('signer_id').notNull().references(() => users.id),
  signerName: text('signer_name').notNull(),
  goLiveDate: text('go_live_date'),
  comment: text('comment').notNull().default(''),
  signedAt: stamp('signed_at').notNull().defaultNow(),
  /** What was signed, as canonical JSON's source: the release, its components' signatures and hashes, waivers, decision. */
  content: jsonb('content').notNull(),
  contentHash: text('content_hash').notNull(),
  verificationCode: text('verification_code').notNull(),
  pdf: bytea('pdf'),
  pdfSha256: text('pdf_sha256'),
  chainLength: bigint('chain_length', { mode: 'number' }),
  chainHeadHash: text('chain_head_hash'),
}, (t) => [index('release_signatures_release_idx').on(t.releaseId, t.id)]);

/** A re-verification a release set due; its date is editable with a reason (the history keeps each change). */
export const dueItems = pgTable('due_items', {
  id: serial('id').primaryKey(),
  laboratoryId: integer('laboratory_id').notNull().references(() => laboratories.id),
  releaseId: integer('release_id').notNull().references(() => releases.id),
  analyteId: integer('analyte_id').notNull().references(() => analytes.id),
  instrumentId: integer('instrument_id').notNull().references(() => instruments.id),
  ruleKey: text('rule_key').notNull(),
  label: text('label').notNull(),
  rule: text('rule').notNull().default(''),
  /** yyyy-mm-dd, the laboratory's day. */
  dueDate: text('due_date').notNull(),
  /** 'open', 'started' (a study or release was started from it), 'done' (what was started is signed). */
  state: text('state').notNull().default('open'),
  startedReleaseId: integer('started_release_id'),
  startedStudyId: integer('started_study_id'),
  version: integer('version').notNull().default(1),
  createdAt: created(),
  updatedAt: stamp('updated_at').notNull().defaultNow(),
}, (t) => [index('due_items_lab_state_idx').on(t.laboratoryId, t.state, t.dueDate)]);

/** The daily reminder of due items, once per laboratory and day (so several processes send it once). */
export const dueReminders = pgTable('due_reminders', {
  laboratoryId: integer('laboratory_id').notNull().references(() => laboratories.id),
  day: text('day').notNull(),
  items: integer('items').notNull(),
  sentAt: stamp('sent_at').notNull().defaultNow(),
}, (t) => [primaryKey({ columns: [t.laboratoryId, t.day] })]);

/** Append-only, hash-chained per laboratory; triggers refuse UPDATE and DELETE. */
export const auditEvents = pgTable('audit_events', {
  id: bigserial('id', { mode: 'number' }).primaryKey(),
  laboratoryId: integer('laboratory_id').references(() => laboratories.id),
  at: stamp('at').notNull().defaultNow(),
  userId: integer('user_id'),
  userName: text('user_name'),
  studyId: integer('study_id'),
  action: text('action').notNull(),
  entity: text('entity').notNull(),
  entityId: text('entity_id'),
  before: jsonb('before'),
  after: jsonb('after'),
  reason: text('reason'),
  previousHash: text('previous_hash').notNull(),
  hash: text('hash').notNull(),
  /** Fingerprint of the server key the hash was made with (HMAC-SHA-256); null for events hashed before the chain was keyed. */
  keyId: text('key_id'),
}, (t) => [index('audit_lab_idx').on(t.laboratoryId, t.id), index('audit_study_idx').on(t.studyId, t.id)]);

/**
 * The newest event of each history chain (a laboratory's, or the one of events with no laboratory), signed
 * with the server key and updated in the transaction of every event: removing the newest events, or
 * rewriting any, no longer matches it unless the key is known.
 */
export const auditChainHeads = pgTable('audit_chain_heads', {
  chain: text('chain').primaryKey(),
  laboratoryId: integer('laboratory_id'),
  length: bigint('length', { mode: 'number' }).notNull(),
  headId: bigint('head_id', { mode: 'number' }).notNull(),
  headHash: text('head_hash').notNull(),
  keyId: text('key_id').notNull(),
  mac: text('mac').notNull(),
  updatedAt: stamp('updated_at').notNull().defaultNow(),
});

/** Signed, append-only marks of a chain's length and head at a moment (each signing, and daily); mirrored in the key folder. */
export const auditCheckpoints = pgTable('audit_checkpoints', {
  id: bigserial('id', { mode: 'number' }).primaryKey(),
  chain: text('chain').notNull(),
  laboratoryId: integer('laboratory_id'),
  length: bigint('length', { mode: 'number' }).notNull(),
  headId: bigint('head_id', { mode: 'number' }).notNull(),
  headHash: text('head_hash').notNull(),
  at: stamp('at').notNull(),
  reason: text('reason').notNull(),
  keyId: text('key_id').notNull(),
  mac: text('mac').notNull(),
}, (t) => [index('audit_checkpoints_chain_idx').on(t.chain, t.id)]);

/** Failed sign-ins counted per account and per address (rate-limiter-flexible's table, owned by the migrations). */
export const signInLimits = pgTable('sign_in_limits', {
  key: varchar('key', { length: 255 }).primaryKey(),
  points: integer('points').notNull().default(0),
  expire: bigint('expire', { mode: 'number' }),
});

/** Outgoing e-mail; a message stays queued until SMTP accepts it, and is retried. */
export const mailOutbox = pgTable('mail_outbox', {
  id: serial('id').primaryKey(),
  laboratoryId: integer('laboratory_id').references(() => laboratories.id),
  to: text('to').array().notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  attempts: integer('attempts').notNull().default(0),
  lastError: text('last_error'),
  nextAttemptAt: stamp('next_attempt_at').notNull().defaultNow(),
  sentAt: stamp('sent_at'),
  createdAt: created(),
});

/** Every message as the local fake SMTP server received it (demo mailbox and tests). */
export const mailMessages = pgTable('mail_messages', {
  id: serial('id').primaryKey(),
  from: text('from').notNull(),
  to: text('to').array().notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  html: text('html'),
  receivedAt: created(),
});

/**
 * Each laboratory's change counter, for the read cache (server/http/read-cache.ts): triggers (migration
 * 0012) move it forward at the commit of every transaction that changes a row of that laboratory in any
 * table whose content an answer can show. It only ever grows; the database refuses anything else.
 */
export const laboratoryVersions = pgTable('laboratory_versions', {
  laboratoryId: integer('laboratory_id').primaryKey(),
  version: bigint('version', { mode: 'number' }).notNull().default(1),
});

/** connect-pg-simple's table, owned by the migrations. */
export const session = pgTable('session', {
  sid: varchar('sid').primaryKey(),
  sess: json('sess').notNull(),
  expire: timestamp('expire', { precision: 6, mode: 'date' }).notNull(),
}, (t) => [index('IDX_session_expire').on(t.expire)]);
