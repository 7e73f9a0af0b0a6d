import ExcelJS from 'exceljs';
import { and, eq, sql } from 'drizzle-orm';
import { addDays } from '@shared/types/due-dates';
import { laboratoryDate } from '@shared/types/lab-time';
import { auditEvents, dueItems, dueReminders, instruments, mailMessages, releaseSignatures, releases, studies } from '../db/schema';
import { flat, pdfPages } from '../reports/testing/pdf-text';
import { analysedComparison, catalogIds } from '../test/fixtures';
import { apiDelete, apiPatch, apiPost, apiPut, binary, Harness, signedIn, signedStudy, startHarness, type Session } from '../test/harness';
import { DEMO_RELEASES } from './demo';
import { sendDueReminders } from './due.service';

/**
 * Releases through the API as a laboratory uses them: templates, a release's board, linking and starting studies,
 * waivers, the director's release signature (refused while a requirement is open), its PDF, the integrity re-check
 * through the component studies, an amendment after release, and re-verification that comes due with its reminder.
 */
let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

const [post, put, patch, del] = [apiPost, apiPut, apiPatch, apiDelete];
const people = async () => ({
  tech: await signedIn(h, 'tech@valeharbor.example'),
  director: await signedIn(h, 'director@valeharbor.example'),
  quality: await signedIn(h, 'quality@valeharbor.example'),
  admin: await signedIn(h, 'admin@valeharbor.example'),
});
const asOwnerWithoutTriggers = (statement: ReturnType<typeof sql>) => h.database.db.transaction(async (tx) => {
  await tx.execute(sql`SET LOCAL session_replication_role = replica`);
  await tx.execute(statement);
});
const eventsOf = async (releaseId: number) => h.database.db.select().from(auditEvents)
  .where(and(eq(auditEvents.entity, 'release'), eq(auditEvents.entityId, String(releaseId))));

/** A lot change of glucose on the candidate line (one requirement: the lot comparison). */
async function lotChange(s: Session, title = `Glucose lot ${Date.now()}`) {
  const ids = await catalogIds(h);
  return (await post(s, '/releases', { changeType: 'reagent-lot', title, analyteId: ids.analyteId, instrumentId: ids.candidateInstrumentId, reagentLot: 'GLU-9001' }).expect(201)).body;
}

/** A lot change whose comparison is a fresh signed study, signed "released" by the director; with its study id. */
async function releasedLotChange() {
  const { tech, director, quality } = await people();
  const release = await lotChange(tech);
  const studyId = await signedStudy(h, `Lot comparison ${Date.now()}`);
  await post(tech, `/releases/${release.id}/studies`, { requirement: 'lot-comparison', studyId }).expect(200);
  const signed = (await post(director, `/releases/${release.id}/sign`, { meaning: 'released', goLiveDate: '2026-12-07', comment: 'Lot GLU-9001 in use from Monday', password: 'parallax-demo' }).expect(200)).body;
  return { release: signed, studyId, tech, director, quality };
}

describe('release templates', () => {
  it('gives every role the four change types with their rules; only the administrator saves one, checked field by field and audited', async () => {
    const { tech, admin } = await people();
    const list = (await tech.agent.get('/api/v1/release-templates').expect(200)).body;
    expect(list.map((t: { changeType: string }) => t.changeType)).toEqual(['new-system', 'reagent-lot', 'relocation', 'custom']);
    const system = list[0];
    expect(system.requirements.map((r: { key: string; kinds: string[] }) => [r.key, r.kinds])).toEqual([
      ['comparison', ['method-comparison']], ['precision', ['precision']], ['reportable-range', ['reportable-range']], ['reference-interval', ['interval-verify', 'interval-establish']],
    ]);
    expect(system.requirements[0].rule).toMatch(/42 CFR 493\.1253/);
    expect(system.dueRules.map((r: { key: string; months: number }) => [r.key, r.months])).toEqual([['comparability', 6], ['calibration-verification', 6], ['interval-review', 12]]);

    const relocation = list.find((t: { changeType: string }) => t.changeType === 'relocation');
    await put(tech, '/release-templates/relocation', { version: relocation.version, requirements: relocation.requirements, dueRules: [] }).expect(403);
    const bad = await put(admin, '/release-templates/relocation', { version: relocation.version, requirements: relocation.requirements, dueRules: [{ key: 'comparability', label: 'Comparability', months: 0 }] }).expect(400);
    expect(bad.body.issues).toEqual([{ path: 'dueRules.0.months', message: 'At least 1 month' }]);
    const twice = await put(admin, '/release-templates/relocation', { version: relocation.version, requirements: [...relocation.requirements, relocation.requirements[0]], dueRules: [] }).expect(400);
    expect(twice.body.issues[0]).toEqual({ path: 'requirements.2.key', message: 'The key "precision" is used twice' });

    const dueRules = [{ key: 'comparability', label: 'Comparability across instruments', months: 3, rule: 'Quarterly after a move (laboratory rule)', kinds: ['method-comparison'] }];
    const saved = (await put(admin, '/release-templates/relocation', { version: relocation.version, requirements: relocation.requirements, dueRules }).expect(200)).body;
    expect(saved).toMatchObject({ version: relocation.version + 1, dueRules });
    await put(admin, '/release-templates/relocation', { version: relocation.version, requirements: relocation.requirements, dueRules: [] }).expect(409);
    const [event] = (await h.database.db.select().from(auditEvents).where(eq(auditEvents.action, 'release-template.updated'))).slice(-1);
    expect(event).toMatchObject({ entityId: 'relocation', userName: 'Sam Whitcombe' });
    expect((event.after as { dueRules: unknown[] }).dueRules).toEqual(dueRules);
    // A relocation created now takes the saved rules.
    const ids = await catalogIds(h);
    const moved = (await post(tech, '/releases', { changeType: 'relocation', title: 'Line 2 moved to room 4', analyteId: ids.analyteId, instrumentId: ids.candidateInstrumentId }).expect(201)).body;
    const stored = (await h.database.db.select().from(releases).where(eq(releases.id, moved.id)))[0];
    expect(stored.dueRules).toEqual(dueRules);
    await put(admin, '/release-templates/relocation', { version: saved.version, requirements: relocation.requirements, dueRules: relocation.dueRules }).expect(200);
  });
});

describe('a release and its board', () => {
  it('creates a new-system release with its four requirements missing, refuses bad input naming the field, and answers 404 to another laboratory', async () => {
    const { tech, director } = await people();
    const ids = await catalogIds(h);
    const created = await post(tech, '/releases', {
      changeType: 'new-system', title: 'Glucose on a third line', analyteId: ids.analyteId, instrumentId: ids.candidateInstrumentId, comparativeInstrumentId: ids.comparativeInstrumentId,
    }).expect(201);
    expect(created.body).toMatchObject({ state: 'open', met: 0, required: 4, ready: false, version: 1 });
    expect(created.body.requirements.map((r: { status: string }) => r.status)).toEqual(['missing', 'missing', 'missing', 'missing']);
    expect(created.body.blockers[0]).toBe('Method comparison: no study linked yet, and not waived');
    expect(created.body.caution).toMatch(/decision support.*director's judgement.*accreditation/);
    expect(created.body.mayISign.allowed).toBe(false);

    const other = await signedIn(h, 'tech@cedarpoint.example');
    await other.agent.get(`/api/v1/releases/${created.body.id}`).expect(404);
    await post(other, `/releases/${created.body.id}/studies`, { requirement: 'comparison', start: { kind: 'method-comparison' } }).expect(404);
    const foreign = await post(other, '/releases', { changeType: 'new-system', title: 'x', analyteId: ids.analyteId, instrumentId: ids.candidateInstrumentId }).expect(400);
    expect(foreign.body.issues[0]).toMatchObject({ path: 'analyteId' });
    const noTitle = await post(tech, '/releases', { changeType: 'new-system', title: ' ', analyteId: ids.analyteId, instrumentId: ids.candidateInstrumentId }).expect(400);
    expect(noTitle.body.issues[0]).toMatchObject({ path: 'title', message: 'Give the release a title' });
    const picked = await post(tech, '/releases', { changeType: 'custom', title: 'x', analyteId: ids.analyteId, instrumentId: ids.candidateInstrumentId, requirements: [{ label: 'Precision', kinds: ['precision'] }] }).expect(403);
    expect(picked.body.error).toMatch(/Only a director picks/);
    const custom = (await post(director, '/releases', {
      changeType: 'custom', title: 'Glucose after a software update', analyteId: ids.analyteId, instrumentId: ids.candidateInstrumentId,
      requirements: [{ label: 'Precision', kinds: ['precision'] }, { label: 'Precision', kinds: ['precision'], rule: 'second run' }],
    }).expect(201)).body;
    expect(custom.requirements.map((r: { key: string }) => r.key)).toEqual(['precision', 'precision-2']);
    const events = await eventsOf(created.body.id);
    expect(events.map((e) => e.action)).toEqual(['release.created']);
  });

  it('starts a study for a requirement pre-filled from the release, links and unlinks studies that fit, and refuses those that do not', async () => {
    const { tech } = await people();
    const ids = await catalogIds(h);
    const release = (await post(tech, '/releases', {
      changeType: 'new-system', title: `Board ${Date.now()}`, analyteId: ids.analyteId, instrumentId: ids.candidateInstrumentId, comparativeInstrumentId: ids.comparativeInstrumentId, reagentLot: 'GLU-7000',
    }).expect(201)).body;
    const started = (await post(tech, `/releases/${release.id}/studies`, { requirement: 'comparison', start: { kind: 'method-comparison' } }).expect(200)).body;
    const comparison = started.requirements[0];
    expect(comparison).toMatchObject({ status: 'in-progress', study: { kind: 'method-comparison', state: 'draft' } });
    const [study] = await h.database.db.select().from(studies).where(eq(studies.id, comparison.study.id));
    expect(study).toMatchObject({ analyteId: ids.analyteId, comparativeInstrumentId: ids.comparativeInstrumentId, candidateInstrumentId: ids.candidateInstrumentId });
    expect((study.settings as { candidateLot: string }).candidateLot).toBe('GLU-7000');
    expect(started.blockers).toContain(`Method comparison: study ${study.id} is a draft`);
    expect((await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200)).body.release).toEqual({ id: release.id, title: release.title, requirement: 'Method comparison' });

    const wrongKind = await post(tech, `/releases/${release.id}/studies`, { requirement: 'precision', studyId: study.id }).expect(400);
    expect(wrongKind.body.issues[0]).toEqual({ path: 'studyId', message: `Study ${study.id} is a method comparison; "Precision" needs precision verification` });
    const other = await lotChange(tech);
    const taken = await post(tech, `/releases/${other.id}/studies`, { requirement: 'lot-comparison', studyId: study.id }).expect(400);
    expect(taken.body.issues[0].message).toBe(`Study ${study.id} already belongs to release ${release.id}`);
    await post(tech, `/releases/${release.id}/studies`, { requirement: 'nothing', studyId: study.id }).expect(400);

    const unlinked = (await del(tech, `/releases/${release.id}/studies/${study.id}`).expect(200)).body;
    expect(unlinked.requirements[0].status).toBe('missing');
    expect((await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200)).body.release).toBeNull();
    await post(tech, `/releases/${other.id}/studies`, { requirement: 'lot-comparison', studyId: study.id }).expect(200);
    expect((await eventsOf(release.id)).map((e) => e.action)).toEqual(['release.created', 'release.study-linked', 'release.study-unlinked']);
  });

  it('changes an open release with the version read; only a director changes a custom change\'s requirements', async () => {
    const { tech, director } = await people();
    const ids = await catalogIds(h);
    const custom = (await post(director, '/releases', {
      changeType: 'custom', title: 'Glucose after a firmware update', analyteId: ids.analyteId, instrumentId: ids.candidateInstrumentId,
      requirements: [{ label: 'Precision', kinds: ['precision'] }],
    }).expect(201)).body;
    const renamed = (await patch(tech, `/releases/${custom.id}`, { version: custom.version, title: 'Glucose after firmware 4.2', note: 'Vendor bulletin 12 (invented)' }).expect(200)).body;
    expect(renamed).toMatchObject({ title: 'Glucose after firmware 4.2', note: 'Vendor bulletin 12 (invented)', version: custom.version + 1 });
    const stale = await patch(tech, `/releases/${custom.id}`, { version: custom.version, title: 'x' }).expect(409);
    expect(stale.body.issues[0]).toMatchObject({ path: 'version' });
    await patch(tech, `/releases/${custom.id}`, { version: renamed.version, requirements: [{ label: 'Comparison', kinds: ['method-comparison'] }] }).expect(403);
    const picked = (await patch(director, `/releases/${custom.id}`, { version: renamed.version, requirements: [{ key: 'precision', label: 'Precision', kinds: ['precision'] }, { label: 'Patient comparison', kinds: ['method-comparison'] }] }).expect(200)).body;
    expect(picked.requirements.map((r: { key: string }) => r.key)).toEqual(['precision', 'patient-comparison']);
    const event = (await eventsOf(custom.id)).find((e) => e.action === 'release.updated')!;
    expect(event).toMatchObject({ before: { title: 'Glucose after a firmware update' }, after: { title: 'Glucose after firmware 4.2' } });
  });

  it('lets only a director waive a requirement, with a reason, audited', async () => {
    const { tech, director } = await people();
    const release = await lotChange(tech);
    await post(tech, `/releases/${release.id}/waivers`, { requirement: 'lot-comparison', reason: 'x' }).expect(403);
    const noReason = await post(director, `/releases/${release.id}/waivers`, { requirement: 'lot-comparison', reason: '  ' }).expect(400);
    expect(noReason.body.issues[0]).toEqual({ path: 'reason', message: 'Give the reason for the waiver' });
    const waived = (await post(director, `/releases/${release.id}/waivers`, { requirement: 'lot-comparison', reason: 'Same lot family; the manufacturer\'s lot data were reviewed (invented)' }).expect(200)).body;
    expect(waived.requirements[0]).toMatchObject({ status: 'waived', waiver: { reason: expect.stringMatching(/^Same lot family/), by: { name: 'Dr. Imani Okafor' } } });
    expect(waived.ready).toBe(true);
    await post(director, `/releases/${release.id}/waivers`, { requirement: 'lot-comparison', reason: 'again' }).expect(409);
    const event = (await eventsOf(release.id)).find((e) => e.action === 'release.waived')!;
    expect(event.reason).toMatch(/^Same lot family/);
  });
});

describe('approval', () => {
  it('refuses to sign while a requirement is open, and on a wrong password or a missing go-live date', async () => {
    const { tech, director } = await people();
    const release = await lotChange(tech);
    const open = await post(director, `/releases/${release.id}/sign`, { meaning: 'released', goLiveDate: '2026-12-10', password: 'parallax-demo' }).expect(409);
    expect(open.body.error).toMatch(/once every requirement is met by a signed study or waived: New lot against current lot: no study linked yet/);
    const studyId = await signedStudy(h, `Lot comparison ${Date.now()}`);
    await post(tech, `/releases/${release.id}/studies`, { requirement: 'lot-comparison', studyId }).expect(200);
    const noDate = await post(director, `/releases/${release.id}/sign`, { meaning: 'released', password: 'parallax-demo' }).expect(400);
    expect(noDate.body.issues[0]).toMatchObject({ path: 'goLiveDate' });
    const wrong = await post(director, `/releases/${release.id}/sign`, { meaning: 'released', goLiveDate: '2026-12-10', password: 'not-it' }).expect(400);
    expect(wrong.body.issues[0]).toMatchObject({ path: 'password' });
    const refused = (await eventsOf(release.id)).find((e) => e.action === 'signature.refused')!;
    expect(refused.after).toMatchObject({ why: 'wrong password', meaning: 'released' });
    await post(tech, `/releases/${release.id}/sign`, { meaning: 'released', goLiveDate: '2026-12-10', password: 'parallax-demo' }).expect(403);
    expect((await h.database.db.select().from(releases).where(eq(releases.id, release.id)))[0].state).toBe('open');
  });

  it('signs "released" with a content hash over the component signatures, stores the PDF and makes the release read-only', async () => {
    const { release, studyId, tech, director } = await releasedLotChange();
    expect(release).toMatchObject({ state: 'released', goLiveDate: '2026-12-07', signerName: 'Dr. Imani Okafor', verificationCode: expect.stringMatching(/^PX-/) });
    const [sig] = await h.database.db.select().from(releaseSignatures).where(eq(releaseSignatures.releaseId, release.id));
    const content = sig.content as { components: { studyId: number; contentHash: string }[]; decision: { meaning: string } };
    const component = release.requirements[0].study;
    expect(content.components).toEqual([{ requirement: 'lot-comparison', studyId, meaning: 'accepted', contentHash: component.contentHash, verificationCode: component.verificationCode }]);
    expect(content.decision.meaning).toBe('released');
    await patch(tech, `/releases/${release.id}`, { version: release.version, title: 'changed' }).expect(409);
    await del(tech, `/releases/${release.id}/studies/${studyId}`).expect(409);
    await post(director, `/releases/${release.id}/sign`, { meaning: 'not-released', password: 'parallax-demo' }).expect(409);
    // The database itself keeps the signature as made.
    await expect(h.database.db.execute(sql`UPDATE release_signatures SET comment = 'x' WHERE id = ${sig.id}`)).rejects.toMatchObject({ cause: { message: expect.stringMatching(/signatures are permanent/) } });

    const pdf = await tech.agent.get(`/api/v1/releases/${release.id}/report.pdf`).buffer(true).parse(binary).expect(200);
    expect(pdf.headers['x-content-sha256']).toBe(sig.pdfSha256);
    const text = flat(pdfPages(pdf.body as Buffer));
    expect(text).toContain('Released for patient testing');
    expect(text).toContain('2026-12-07');
    expect(text).toContain(component.verificationCode);
    expect(text).toContain(release.verificationCode);
    expect(text).toMatch(/decision support/i);
    // The component's key figures, from its kind (server/kinds/method-comparison keyFigures).
    expect(text).toMatch(/Median bias -?\d\.\d\d mmol\/L \(-?\d\.\d\d to -?\d\.\d\d\), 95% CI; n = 40/);
    expect(text).toMatch(/Bias at 7\.0 mmol\/L: .*within the allowable bias/);
  });

  it('keeps segregation of duties: a director who entered rows of a component does not sign the release', async () => {
    const { director } = await people();
    const lead = await signedIn(h, 'lead@valeharbor.example');
    const release = await lotChange(lead);
    const study = await analysedComparison(h, lead, `Lot comparison entered by the lead ${Date.now()}`);
    await post(lead, `/studies/${study.id}/submit`).expect(200);
    await post(director, `/studies/${study.id}/sign`, { meaning: 'accepted', password: 'parallax-demo' }).expect(200);
    await post(lead, `/releases/${release.id}/studies`, { requirement: 'lot-comparison', studyId: study.id }).expect(200);
    const board = (await lead.agent.get(`/api/v1/releases/${release.id}`).expect(200)).body;
    expect(board.mayISign).toEqual({ allowed: false, why: 'You entered rows of a study in this release; another director signs it (segregation of duties).' });
    const refused = await post(lead, `/releases/${release.id}/sign`, { meaning: 'released', goLiveDate: '2026-12-10', password: 'parallax-demo' }).expect(403);
    expect(refused.body.error).toMatch(/segregation of duties/);
    expect((await director.agent.get(`/api/v1/releases/${release.id}`).expect(200)).body.mayISign.allowed).toBe(true);
  });

  it('signs "not released" when a component was not accepted, and refuses "released" then', async () => {
    const { tech, director } = await people();
    const release = await lotChange(tech);
    const study = await analysedComparison(h, tech, `Lot comparison not accepted ${Date.now()}`);
    await post(tech, `/studies/${study.id}/submit`).expect(200);
    await post(director, `/studies/${study.id}/sign`, { meaning: 'not-accepted', password: 'parallax-demo' }).expect(200);
    await post(tech, `/releases/${release.id}/studies`, { requirement: 'lot-comparison', studyId: study.id }).expect(200);
    const refused = await post(director, `/releases/${release.id}/sign`, { meaning: 'released', goLiveDate: '2026-12-10', password: 'parallax-demo' }).expect(409);
    expect(refused.body.error).toMatch(/"New lot against current lot" was not accepted/);
    const signed = (await post(director, `/releases/${release.id}/sign`, { meaning: 'not-released', goLiveDate: '2026-12-10', comment: 'Lot bias too large', password: 'parallax-demo' }).expect(200)).body;
    expect(signed).toMatchObject({ state: 'not-released', goLiveDate: null });
    expect(signed.requirements[0].status).toBe('not-met');
  });

  it('re-checks a release through its components, and fails when a component row or a waiver is changed behind the application\'s back', async () => {
    const { release, studyId, quality } = await releasedLotChange();
    const good = (await post(quality, `/releases/${release.id}/integrity-check`).expect(200)).body;
    expect(good.passed).toBe(true);
    expect(good.checks.map((c: { name: string }) => c.name)).toEqual(['Content hash', 'Signed PDF', 'History chain', 'Component studies']);
    expect(good.components).toEqual([expect.objectContaining({ requirement: 'lot-comparison', studyId, passed: true })]);
    expect(good.components[0].checks.map((c: { name: string }) => c.name)).toEqual(['Content hash', 'Signed PDF', 'Analysis input', 'History chain']);

    await asOwnerWithoutTriggers(sql`UPDATE specimens SET candidate = candidate + 0.5, candidate_text = 'tampered' WHERE study_id = ${studyId} AND position = 3`);
    const bad = (await post(quality, `/releases/${release.id}/integrity-check`).expect(200)).body;
    expect(bad.passed).toBe(false);
    expect(bad.checks.find((c: { name: string }) => c.name === 'Component studies')).toMatchObject({ passed: false, detail: `Study ${studyId} fails its own re-check.` });
    expect(bad.checks.find((c: { name: string }) => c.name === 'Content hash').passed).toBe(true);

    const { release: waivedRelease, director } = await (async () => {
      const s = await people();
      const r = await lotChange(s.tech);
      await post(s.director, `/releases/${r.id}/waivers`, { requirement: 'lot-comparison', reason: 'Reviewed the manufacturer\'s lot data (invented)' }).expect(200);
      const signed = (await post(s.director, `/releases/${r.id}/sign`, { meaning: 'released', goLiveDate: '2026-12-08', password: 'parallax-demo' }).expect(200)).body;
      return { release: signed, director: s.director };
    })();
    expect((await post(director, `/releases/${waivedRelease.id}/integrity-check`).expect(200)).body.passed).toBe(true);
    await asOwnerWithoutTriggers(sql`UPDATE release_waivers SET reason = 'rewritten' WHERE release_id = ${waivedRelease.id}`);
    const rewritten = (await post(director, `/releases/${waivedRelease.id}/integrity-check`).expect(200)).body;
    expect(rewritten.checks.find((c: { name: string }) => c.name === 'Content hash')).toMatchObject({ passed: false });
  });

  it('makes a released release "needs review" when a component is amended, links the amendment, and lets the director sign it again', async () => {
    const { release, studyId, tech, director } = await releasedLotChange();
    const amendment = (await post(tech, `/studies/${studyId}/amend`, { reason: 'Two specimens were mislabelled' }).expect(201)).body;
    const after = (await tech.agent.get(`/api/v1/releases/${release.id}`).expect(200)).body;
    expect(after.state).toBe('needs-review');
    expect(after.reviewReasons).toEqual([`New lot against current lot: study ${studyId} was amended after the release (now study ${amendment.id}, not yet signed)`]);
    expect(after.requirements[0]).toMatchObject({ status: 'in-progress', study: { id: amendment.id } });
    const event = (await eventsOf(release.id)).find((e) => e.action === 'release.needs-review')!;
    expect(event).toMatchObject({ reason: 'Two specimens were mislabelled', studyId });
    await post(director, `/releases/${release.id}/sign`, { meaning: 'released', goLiveDate: '2026-12-07', password: 'parallax-demo' }).expect(409);

    // The amendment is analysed, signed, and the release is signed again over the new component.
    const queued = await post(tech, `/studies/${amendment.id}/analyses`).expect(202);
    const { waitForAnalysis } = await import('../test/fixtures');
    expect((await waitForAnalysis(tech, queued.body.id)).state).toBe('done');
    await post(tech, `/studies/${amendment.id}/submit`).expect(200);
    await post(director, `/studies/${amendment.id}/sign`, { meaning: 'accepted', password: 'parallax-demo' }).expect(200);
    const again = (await post(director, `/releases/${release.id}/sign`, { meaning: 'released', goLiveDate: '2026-12-07', password: 'parallax-demo' }).expect(200)).body;
    expect(again.state).toBe('released');
    expect(again.signatures).toHaveLength(2);
    expect(again.signatures[0].contentHash).not.toBe(again.signatures[1].contentHash);
  });
});

describe('re-verification that comes due', () => {
  const demoRelease = async () => (await h.database.db.select().from(releases).where(eq(releases.title, DEMO_RELEASES.newSystem)))[0];

  it('lists the demo release\'s due items with the calibration verification overdue, to the roles who act on them', async () => {
    const { tech, quality, admin } = await people();
    const release = await demoRelease();
    const due = (await quality.agent.get('/api/v1/due').query({ releaseId: release.id }).expect(200)).body;
    expect(due.map((d: { ruleKey: string }) => d.ruleKey)).toEqual(['calibration-verification', 'comparability', 'interval-review']);
    expect(due.map((d: { kinds: string[] }) => d.kinds)).toEqual([['reportable-range'], ['method-comparison'], ['interval-verify', 'interval-establish']]);
    expect(due[0]).toMatchObject({ status: 'overdue', daysLeft: -3, dueWords: 'overdue by 3 days', analyte: { name: 'Glucose' }, instrument: { name: 'Chemistry line 2' } });
    expect(due[1]).toMatchObject({ status: 'later', dueWords: expect.stringMatching(/^due in 1\d\d days$/) });
    const overdue = (await tech.agent.get('/api/v1/due').query({ status: 'overdue' }).expect(200)).body;
    expect(overdue.map((d: { id: number }) => d.id)).toContain(due[0].id);
    await admin.agent.get('/api/v1/due').expect(403);
    const board = (await tech.agent.get(`/api/v1/releases/${release.id}`).expect(200)).body;
    expect(board).toMatchObject({ state: 'released', met: 4, required: 4 });
    expect(board.due).toHaveLength(3);
  });

  it('sends the daily reminder once per laboratory day, driven by the clock, to directors and quality officers', async () => {
    const release = await demoRelease();
    const [comparability] = await h.database.db.select().from(dueItems).where(and(eq(dueItems.releaseId, release.id), eq(dueItems.ruleKey, 'comparability')));
    // The day before comparability falls due, at noon in the laboratory (its zone is Europe/…; noon UTC is the same day).
    const day = addDays(comparability.dueDate, -1);
    const clock = new Date(`${day}T12:00:00Z`);
    expect(laboratoryDate(clock, 'UTC')).toBe(day);
    expect(await sendDueReminders(h.database.db, clock, 'http://parallax.test')).toBeGreaterThanOrEqual(1);
    expect(await sendDueReminders(h.database.db, new Date(clock.getTime() + 60 * 60 * 1000), 'http://parallax.test')).toBe(0);
    const [reminder] = await h.database.db.select().from(dueReminders).where(and(eq(dueReminders.laboratoryId, release.laboratoryId), eq(dueReminders.day, day)));
    expect(reminder.items).toBeGreaterThanOrEqual(2);
    await h.ctx.mail.flush();
    let mails: (typeof mailMessages.$inferSelect)[] = [];
    for (let i = 0; i < 40 && !mails.length; i++) {
      mails = (await h.database.db.select().from(mailMessages)).filter((m) => m.subject.startsWith('Re-verification') && m.text.includes(`as of ${day}`));
      if (!mails.length) await new Promise((r) => setTimeout(r, 100));
    }
    expect(mails).toHaveLength(1);
    // Directors and quality officers (other suites may add more of them to this database); never a technologist or an administrator.
    expect(mails[0].to).toEqual(expect.arrayContaining(['director@valeharbor.example', 'lead@valeharbor.example', 'quality@valeharbor.example']));
    expect(mails[0].to).not.toContain('tech@valeharbor.example');
    expect(mails[0].to).not.toContain('admin@valeharbor.example');
    expect(mails[0].text).toContain(`Comparability across instruments, Glucose on Chemistry line 2: due ${comparability.dueDate} (due in 1 day)`);
    expect(mails[0].text).toMatch(/Calibration verification, Glucose on Chemistry line 2: due \d{4}-\d\d-\d\d \(overdue by \d+ days\)/);
    expect(await sendDueReminders(h.database.db, new Date(clock.getTime() + 24 * 60 * 60 * 1000), 'http://parallax.test')).toBeGreaterThanOrEqual(1);
  });

  it('moves a due date only for a director and with a reason; starting a study from an item links them, and signing it completes the item', async () => {
    const { tech, director } = await people();
    const release = await demoRelease();
    const [item] = await h.database.db.select().from(dueItems).where(and(eq(dueItems.releaseId, release.id), eq(dueItems.ruleKey, 'interval-review')));
    await patch(tech, `/due/${item.id}`, { version: item.version, dueDate: '2027-10-01', reason: 'x' }).expect(403);
    const noReason = await patch(director, `/due/${item.id}`, { version: item.version, dueDate: '2027-10-01', reason: '' }).expect(400);
    expect(noReason.body.issues[0]).toMatchObject({ path: 'reason' });
    const moved = (await patch(director, `/due/${item.id}`, { version: item.version, dueDate: '2027-10-01', reason: 'Aligned with the yearly review of all chemistry intervals' }).expect(200)).body;
    expect(moved).toMatchObject({ dueDate: '2027-10-01', version: item.version + 1 });
    const event = (await eventsOf(release.id)).filter((e) => e.action === 'due.moved').at(-1)!;
    expect(event).toMatchObject({ reason: 'Aligned with the yearly review of all chemistry intervals', before: { dueDate: item.dueDate }, after: { dueDate: '2027-10-01' } });

    const wrongKind = await post(tech, `/due/${item.id}/start`, { kind: 'precision' }).expect(400);
    expect(wrongKind.body.issues[0]).toEqual({ path: 'kind', message: '"Reference interval review" is re-verified by reference interval: verify or reference interval: establish' });
    const started = (await post(tech, `/due/${item.id}/start`, { kind: 'interval-verify' }).expect(200)).body;
    expect(started).toMatchObject({ state: 'started', status: 'started', startedStudy: { id: expect.any(Number) } });
    await post(tech, `/due/${item.id}/start`, { kind: 'interval-verify' }).expect(409);
    const studyId = started.startedStudy.id;
    const [line2] = (await h.database.db.select().from(instruments).where(eq(instruments.name, 'Chemistry line 2')));
    expect((await h.database.db.select().from(studies).where(eq(studies.id, studyId)))[0]).toMatchObject({ kind: 'interval-verify', instrumentId: line2.id });
    // The verification is entered, analysed, submitted and signed: the due item is done.
    const study = (await tech.agent.get(`/api/v1/studies/${studyId}`).expect(200)).body;
    const withStated = (await patch(tech, `/studies/${studyId}`, { version: study.version, settings: { statedLower: 3.9, statedUpper: 6.1, statedSource: 'Package insert (invented)', resamples: 1000 } }).expect(200)).body;
    const rows = Array.from({ length: 20 }, (_, i) => ({ label: `R${i + 1}`, value: (4.2 + (i % 10) * 0.15).toFixed(1) }));
    await put(tech, `/studies/${studyId}/specimens`, { version: withStated.version, rows }).expect(200);
    const queued = await post(tech, `/studies/${studyId}/analyses`).expect(202);
    const { waitForAnalysis } = await import('../test/fixtures');
    expect((await waitForAnalysis(tech, queued.body.id)).state).toBe('done');
    await post(tech, `/studies/${studyId}/submit`).expect(200);
    await post(director, `/studies/${studyId}/sign`, { meaning: 'accepted', password: 'parallax-demo' }).expect(200);
    const after = (await tech.agent.get('/api/v1/due').query({ status: 'all', releaseId: release.id }).expect(200)).body;
    expect(after.find((d: { id: number }) => d.id === item.id)).toMatchObject({ state: 'done', status: 'done' });
    expect((await eventsOf(release.id)).map((e) => e.action)).toEqual(expect.arrayContaining(['due.set', 'due.moved', 'due.started', 'due.done']));
  });

  it('starts a release from a due item, and marks the item done when that release is signed', async () => {
    const { tech } = await people();
    const release = await demoRelease();
    const [calibration] = await h.database.db.select().from(dueItems).where(and(eq(dueItems.releaseId, release.id), eq(dueItems.ruleKey, 'calibration-verification')));
    const ids = await catalogIds(h);
    const next = (await post(tech, '/releases', { changeType: 'custom', title: 'Calibration verification, glucose line 2', analyteId: ids.analyteId, instrumentId: ids.candidateInstrumentId, dueItemId: calibration.id }).expect(201)).body;
    expect(next.fromDueItem).toEqual({ id: calibration.id, label: 'Calibration verification' });
    const [item] = await h.database.db.select().from(dueItems).where(eq(dueItems.id, calibration.id));
    expect(item).toMatchObject({ state: 'started', startedReleaseId: next.id });
    const again = await post(tech, '/releases', { changeType: 'custom', title: 'x', analyteId: ids.analyteId, instrumentId: ids.candidateInstrumentId, dueItemId: calibration.id }).expect(400);
    expect(again.body.issues[0]).toMatchObject({ path: 'dueItemId' });
  });
});

describe('the releases archive', () => {
  it('finds releases by words, verification code, change type and state, exports them for auditors, and keeps each one\'s history', async () => {
    const { tech, quality } = await people();
    const [demo] = await h.database.db.select().from(releases).where(eq(releases.title, DEMO_RELEASES.newSystem));
    const code = (await tech.agent.get(`/api/v1/releases/${demo.id}`).expect(200)).body.verificationCode as string;
    const byCode = (await quality.agent.get('/api/v1/releases').query({ q: code.toLowerCase().replace(/-/g, ' ') }).expect(200)).body;
    expect(byCode.items.map((r: { id: number }) => r.id)).toEqual([demo.id]);
    const open = (await quality.agent.get('/api/v1/releases').query({ changeType: 'reagent-lot', state: 'open', q: 'GLU-4610' }).expect(200)).body;
    expect(open.items.map((r: { title: string }) => r.title)).toEqual([DEMO_RELEASES.lotChange]);
    expect(open.items[0]).toMatchObject({ met: 0, required: 1, signerName: null });
    await tech.agent.get('/api/v1/releases/export.xlsx').expect(403);
    const xlsx = await quality.agent.get('/api/v1/releases/export.xlsx').query({ q: 'Chemistry line 2' }).buffer(true).parse(binary).expect(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(xlsx.body as never);
    const titles = wb.getWorksheet('Releases')!.getColumn(2).values;
    expect(titles).toEqual(expect.arrayContaining([DEMO_RELEASES.newSystem, DEMO_RELEASES.lotChange]));
    const history = (await quality.agent.get(`/api/v1/releases/${demo.id}/history`).expect(200)).body;
    expect(history.map((e: { headline: string }) => e.headline)).toEqual(expect.arrayContaining([
      `Release created: "${DEMO_RELEASES.newSystem}"`, expect.stringMatching(/^Study \d+ linked to "Precision"$/), expect.stringMatching(/^Release signed: released for patient testing, go-live \d{4}-\d\d-\d\d$/),
    ]));
  });
});
