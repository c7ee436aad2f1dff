import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { defaultChemistryPort } from '@shared/thermal';
import type { LabScenario } from '@shared/lab-logs';
import { loggerCsv, syntheticSamples } from '@shared/lab-logs/__fixtures__/synthetic-log';
import { demo, harbour, useHarness } from './support/harness';

const h = useHarness();
const bearer = (t: string) => ({ Authorization: `Bearer ${t}` });
const created: number[] = [];

beforeAll(async () => {
  const { startRunWorker } = await import('../../backend/src/runs/run-queue');
  const { executeRun } = await import('../../backend/src/runs/run-executor');
  await startRunWorker(({ runId }) => executeRun(runId));
});
afterAll(async () => {
  // Retire what these tests applied, so other suites' runs see the uncalibrated model.
  const { CalibrationRecord } = await import('../../backend/src/lab-logs/calibration.model');
  if (created.length) await CalibrationRecord.update({ active: false }, { where: { labLogId: created } });
  const { stopRunQueue } = await import('../../backend/src/runs/run-queue');
  await stopRunQueue();
});

async function counts() {
  const { LabLogRecord } = await import('../../backend/src/lab-logs/lab-log.model');
  return LabLogRecord.count();
}

async function ingredientByName(token: string, name: string) {
  const res = await request(h.app).get('/api/ingredients').query({ q: name }).set(bearer(token));
  const found = (res.body.items ?? []).find((i: { name: string }) => i.name === name);
  if (!found) throw new Error(`demo ingredient ${name} not found`);
  return found as { id: number; name: string; process: LabScenario['components'][number]['process'] };
}

/** Truth used to make the log: the pack lost heat 25 % faster than modelled and dissolved at half the default rate. */
const TRUTH = { uaMultiplier: 1.25, enthalpyFactor: 0.95, rateMultiplier: 0.5, heatCapacityFactor: 1 };

async function makeLog(token: string) {
  const an = await ingredientByName(token, 'Ammonium nitrate');
  const water = await ingredientByName(token, 'Water');
  const scenario: LabScenario = {
    components: [
      { key: String(water.id), massG: 120, process: { kind: 'inert', role: 'water' } },
      { key: String(an.id), massG: 80, process: an.process },
    ],
    initialTempC: 24,
    ambientC: 24,
    contact: 'still-air',
    packAreaM2: 0.03,
    packHeatCapacityJPerK: 24,
    horizonMin: 45,
  };
  const samples = syntheticSamples(defaultChemistryPort(), scenario, TRUTH, { everySec: 15, noiseK: 0.1 });
  const csv = loggerCsv(samples, { ambientC: 24 });
  const meta = {
    name: 'Bench test AN 80 g / water 120 g',
    components: [
      { ingredientId: water.id, massG: 120 },
      { ingredientId: an.id, massG: 80 },
    ],
    mapping: { timeColumn: 0, timeUnit: 'clock', tempColumns: [1, 2], tempUnit: 'F' },
    conditions: { ambientC: 24, contact: 'still-air', packAreaM2: 0.03, channel: 0 },
  };
  return { csv, meta, an, water };
}

describe('lab logs: upload', () => {
  it('preview detects the delimiter, the header under a preamble, clock and °F columns, and stores nothing', async () => {
    const token = await h.token(demo.chemist);
    const { csv } = await makeLog(token);
    const before = await counts();
    const res = await request(h.app).post('/api/lab-logs/preview').set(bearer(token)).attach('file', Buffer.from(csv.replaceAll(',', ';')), { filename: 'bench.csv', contentType: 'text/csv' });
    expect(res.status).toBe(200);
    expect(res.body.preview.delimiter).toBe(';');
    expect(res.body.preview.headerRow).toBe(4);
    expect(res.body.preview.columns.map((c: { kind: string }) => c.kind)).toEqual(['clock', 'number', 'number']);
    expect(res.body.preview.suggested).toEqual({ timeColumn: 0, timeUnit: 'clock', tempColumns: [1, 2], tempUnit: 'F' });
    expect(res.body.preview.rows).toBeUndefined();
    expect(await counts()).toBe(before);
  });

  it('a malformed file answers 400 with the bad rows named, and nothing is stored', async () => {
    const token = await h.token(demo.chemist);
    const { csv, meta } = await makeLog(token);
    const lines = csv.split('\n');
    lines[10] = lines[10]!.replace(/,[^,]+,/, ',abc,'); // line 11: unreadable reading
    lines[20] = lines[5]!; // line 21: time jumps back to the first sample
    const before = await counts();
    const res = await request(h.app).post('/api/lab-logs').set(bearer(token)).field('meta', JSON.stringify(meta)).attach('file', Buffer.from(lines.join('\n')), { filename: 'bad.csv', contentType: 'text/csv' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_lab_log');
    const fields = res.body.error.fields.map((f: { field: string }) => f.field);
    expect(fields.some((f: string) => f.startsWith('row 11'))).toBe(true);
    expect(fields.some((f: string) => f.startsWith('row 21'))).toBe(true);
    expect(await counts()).toBe(before);
  });

  it('a binary file is 415, an oversized one 413, bad meta 400 — and nothing is stored', async () => {
    const token = await h.token(demo.chemist);
    const { meta } = await makeLog(token);
    const before = await counts();
    const bin = await request(h.app).post('/api/lab-logs').set(bearer(token)).field('meta', JSON.stringify(meta)).attach('file', Buffer.from([0x50, 0x4b, 0x03, 0x04, 0, 0, 1]), { filename: 'log.csv', contentType: 'text/csv' });
    expect(bin.status).toBe(415);
    const big = await request(h.app).post('/api/lab-logs/preview').set(bearer(token)).attach('file', Buffer.alloc(5 * 1024 * 1024, '1'), { filename: 'big.csv', contentType: 'text/csv' });
    expect(big.status).toBe(413);
    const badMeta = await request(h.app).post('/api/lab-logs').set(bearer(token)).field('meta', JSON.stringify({ ...meta, mapping: { ...meta.mapping, tempUnit: 'K' } })).attach('file', Buffer.from('t,T\n0,1\n1,2\n'), { filename: 'x.csv', contentType: 'text/csv' });
    expect(badMeta.status).toBe(400);
    expect(badMeta.body.error.fields.some((f: { field: string }) => f.field === 'mapping.tempUnit')).toBe(true);
    expect(await counts()).toBe(before);
  });

  it('only chemists and admins upload, fit and apply; no session is 401', async () => {
    const { csv, meta } = await makeLog(await h.token(demo.chemist));
    for (const role of ['designer', 'reviewer'] as const) {
      const t = await h.token(demo[role]);
      expect((await request(h.app).post('/api/lab-logs/preview').set(bearer(t)).attach('file', Buffer.from(csv), { filename: 'a.csv', contentType: 'text/csv' })).status).toBe(403);
      expect((await request(h.app).post('/api/calibrations').set(bearer(t)).send({ labLogId: 1, scope: 'contact' })).status).toBe(403);
    }
    expect((await request(h.app).post('/api/lab-logs').field('meta', JSON.stringify(meta)).attach('file', Buffer.from(csv), { filename: 'a.csv', contentType: 'text/csv' })).status).toBe(401);
    expect((await request(h.app).get('/api/lab-logs')).status).toBe(401);
  });
});

describe('lab logs: overlay, fit, calibration', () => {
  it('stores a log, overlays the prediction, fits UA, enthalpy and rate, and applies them (audited); other workspaces get 404', async () => {
    const chemist = await h.token(demo.chemist);
    const { csv, meta, an } = await makeLog(chemist);
    const up = await request(h.app).post('/api/lab-logs').set(bearer(chemist)).field('meta', JSON.stringify(meta)).attach('file', Buffer.from(csv), { filename: 'bench-an.csv', contentType: 'text/csv' });
    expect(up.status).toBe(201);
    const id = up.body.labLog.id as number;
    created.push(id);
    expect(up.body.labLog.sampleCount).toBe(181);
    expect(up.body.labLog.channels).toEqual(['Pack (°F)', 'Ambient (°F)']);

    const detail = await request(h.app).get(`/api/lab-logs/${id}`).set(bearer(await h.token(demo.designer)));
    expect(detail.status).toBe(200);
    // The log was made with UA × 1.25 and half the rate: the nominal model misses it by more than the 0.1 K noise.
    expect(detail.body.predicted.overlay.rmseK).toBeGreaterThan(0.3);
    expect(detail.body.labLog.sha256).toMatch(/^[0-9a-f]{64}$/);

    expect((await request(h.app).get(`/api/lab-logs/${id}`).set(bearer(await h.token(harbour.chemist)))).status).toBe(404);
    expect((await request(h.app).post(`/api/lab-logs/${id}/fit`).set(bearer(await h.token(harbour.chemist))).send({})).status).toBe(404);
    expect((await request(h.app).post(`/api/lab-logs/${id}/fit`).set(bearer(await h.token(demo.designer))).send({})).status).toBe(403);

    const fit = await request(h.app).post(`/api/lab-logs/${id}/fit`).set(bearer(chemist)).send({});
    expect(fit.status).toBe(200);
    const f = fit.body.fit;
    // The workspace's species data and the default port may differ slightly; 5 % on UA and rate, 2 % on the enthalpy factor.
    expect(Math.abs(f.uaMultiplier.value / TRUTH.uaMultiplier - 1)).toBeLessThan(0.05);
    expect(Math.abs(f.enthalpyFactor.value / TRUTH.enthalpyFactor - 1)).toBeLessThan(0.02);
    expect(Math.abs(f.rateMultiplier.value / TRUTH.rateMultiplier - 1)).toBeLessThan(0.05);
    expect(f.uaMultiplier.standardError).toBeGreaterThan(0);
    expect(f.rmseK).toBeLessThan(0.15);
    expect(f.method).toMatch(/Levenberg–Marquardt/);

    const after = await request(h.app).get(`/api/lab-logs/${id}`).set(bearer(chemist));
    expect(after.body.fitted.overlay.rmseK).toBeLessThan(0.15);

    const contact = await request(h.app).post('/api/calibrations').set(bearer(chemist)).send({ labLogId: id, scope: 'contact' });
    expect(contact.status).toBe(201);
    expect(contact.body.calibration).toMatchObject({ scope: 'contact', contactCase: 'still-air', active: true });
    expect(contact.body.calibration.parameters.uaMultiplier).toBeCloseTo(f.uaMultiplier.value, 10);
    const kinetics = await request(h.app).post('/api/calibrations').set(bearer(chemist)).send({ labLogId: id, scope: 'ingredient', ingredientId: an.id });
    expect(kinetics.status).toBe(201);
    expect(kinetics.body.calibration.parameters.rateConstantPerMin).toBeCloseTo(f.rateConstantPerMin.value, 10);
    expect(kinetics.body.calibration.parameters.enthalpyFactor).toBeCloseTo(f.enthalpyFactor.value, 10);

    const { AuditEventRecord } = await import('../../backend/src/audit/audit-event.model');
    const audit = await AuditEventRecord.findAll({ where: { action: 'calibration.apply', entityId: [String(contact.body.calibration.id), String(kinetics.body.calibration.id)] } });
    expect(audit).toHaveLength(2);
    expect(audit[0]!.detail).toHaveProperty('after');

    const list = await request(h.app).get('/api/calibrations').set(bearer(await h.token(demo.reviewer)));
    expect(list.body.items.filter((c: { active: boolean; labLogId: number }) => c.active && c.labLogId === id)).toHaveLength(2);
    expect((await request(h.app).get('/api/calibrations').set(bearer(await h.token(harbour.chemist)))).body.items.some((c: { labLogId: number }) => c.labLogId === id)).toBe(false);

    // A run started after applying records both calibrations in its data snapshot.
    const designer = await h.token(demo.designer);
    const brief = (await request(h.app).post('/api/briefs').set(bearer(designer)).send({ name: 'Calibrated sideline (API test)', packType: 'cold', targetTempC: 5, reachWithinMin: 3, holdMin: 15, maxMassG: 200, maxUnitCost: '0.60' })).body.brief;
    const runId = (await request(h.app).post(`/api/briefs/${brief.id}/runs`).set(bearer(designer))).body.runId;
    let run;
    for (const deadline = Date.now() + 60_000; ; ) {
      run = (await request(h.app).get(`/api/runs/${runId}`).set(bearer(designer))).body;
      if (!['queued', 'running'].includes(run.status) || Date.now() > deadline) break;
      await new Promise((r) => setTimeout(r, 200));
    }
    expect(run.status).toBe('succeeded');
    expect(run.dataSnapshot.calibrations.contacts['still-air']).toMatchObject({ uaMultiplier: f.uaMultiplier.value, calibrationId: contact.body.calibration.id });
    expect(run.dataSnapshot.calibrations.ingredients[String(an.id)]).toMatchObject({ rateConstantPerMin: f.rateConstantPerMin.value, calibrationId: kinetics.body.calibration.id });

    // Confidence of the top candidate: a band and a probability, computed on demand and cached.
    const top = run.candidates[0];
    const conf = await request(h.app).get(`/api/candidates/${top.id}/confidence`).set(bearer(designer));
    expect(conf.status).toBe(200);
    const c = conf.body.confidence;
    expect(c.samples).toBe(200);
    expect(c.probabilityMeetsBrief).toBeGreaterThanOrEqual(0);
    expect(c.probabilityMeetsBrief).toBeLessThanOrEqual(1);
    expect(c.calibrated).toBe(true);
    for (const b of c.band) expect(b.p5).toBeLessThanOrEqual(b.p95);
    const again = await request(h.app).get(`/api/candidates/${top.id}/confidence`).set(bearer(designer));
    expect(again.body.confidence.elapsedMs).toBe(c.elapsedMs);
    expect((await request(h.app).get(`/api/candidates/${top.id}/confidence`).set(bearer(await h.token(harbour.designer)))).status).toBe(404);
  }, 120_000);

  it('applying to an ingredient that is not in the logged mixture is refused', async () => {
    const chemist = await h.token(demo.chemist);
    const { csv, meta } = await makeLog(chemist);
    const id = (await request(h.app).post('/api/lab-logs').set(bearer(chemist)).field('meta', JSON.stringify({ ...meta, name: 'Unfitted' })).attach('file', Buffer.from(csv), { filename: 'b.csv', contentType: 'text/csv' })).body.labLog.id;
    created.push(id);
    const unfitted = await request(h.app).post('/api/calibrations').set(bearer(chemist)).send({ labLogId: id, scope: 'contact' });
    expect(unfitted.status).toBe(400);
    const urea = await ingredientByName(chemist, 'Urea');
    await request(h.app).post(`/api/lab-logs/${id}/fit`).set(bearer(chemist)).send({ fit: ['ua'] });
    const wrong = await request(h.app).post('/api/calibrations').set(bearer(chemist)).send({ labLogId: id, scope: 'ingredient', ingredientId: urea.id });
    expect(wrong.status).toBe(400);
    const list = await request(h.app).get('/api/lab-logs').query({ candidateId: 999999 }).set(bearer(chemist));
    expect(list.body.items).toEqual([]);
  }, 60_000);
});
