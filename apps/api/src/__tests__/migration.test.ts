import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import bcrypt from 'bcryptjs';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp, type PulsewrightApp } from '../app.js';
import { openDatabase } from '../db/database.js';
import { migrate } from '../db/migrate.js';
import { signIn } from './helpers.js';

/**
 * Migration 0002 on a database made by the previous release: the schema of migration 0001, and
 * study revisions shaped as that release's StudyService wrote them (`method`, `parameters` = the
 * modulation without its method, with the defaults its validator filled in, `load` with its
 * frequency, `filter` with an optional loadR). After the new release starts on it, every study
 * reads back through the API with the design the migration made, every old revision is kept, and
 * the old columns are as they were.
 */

const PASSWORD = 'previous-release-password';
const NOW = new Date('2026-11-20T09:00:00.000Z');

interface OldRevision {
  method: string;
  parameters: Record<string, unknown>;
  load: Record<string, unknown> | null;
  filter: Record<string, unknown> | null;
  note?: string;
  restoredFrom?: number;
}

interface OldStudy {
  name: string;
  revisions: OldRevision[];
  /** The design each revision must read back as. */
  designs: Record<string, unknown>[];
}

const PUMP_FILTER = {
  l: 0.0011,
  c: 0.0000068,
  rDamping: 2.2,
  dampingPlacement: 'series-with-capacitor',
};

/** Invented studies covering every rule of the migration (values as the previous seed and forms wrote them). */
const OLD_STUDIES: OldStudy[] = [
  {
    name: 'Unipolar baseline (two revisions, load at 60 Hz, filter)',
    revisions: [
      {
        method: 'sine-triangle',
        parameters: {
          scheme: 'unipolar',
          ma: 0.86,
          mf: 400,
          vdc: 375,
          sampling: 'natural',
          carrierPhase: 0,
        },
        load: { r: 15.5, l: 0.021, frequency: 60 },
        filter: PUMP_FILTER,
        note: 'first',
      },
      {
        method: 'sine-triangle',
        parameters: {
          scheme: 'unipolar',
          ma: 0.88,
          mf: 400,
          vdc: 375,
          sampling: 'natural',
          carrierPhase: 0,
        },
        load: { r: 15.5, l: 0.021, frequency: 60 },
        filter: PUMP_FILTER,
        note: 'index raised',
      },
    ],
    designs: [
      {
        vdc: 375,
        fundamentalFrequency: 60,
        carrierFrequency: 24_000,
        modulation: {
          method: 'sine-triangle',
          scheme: 'unipolar',
          ma: 0.86,
          sampling: 'natural',
          carrierPhase: 0,
        },
        filter: PUMP_FILTER,
        load: { r: 15.5, l: 0.021 },
      },
      {
        vdc: 375,
        fundamentalFrequency: 60,
        carrierFrequency: 24_000,
        modulation: {
          method: 'sine-triangle',
          scheme: 'unipolar',
          ma: 0.88,
          sampling: 'natural',
          carrierPhase: 0,
        },
        filter: PUMP_FILTER,
        load: { r: 15.5, l: 0.021 },
      },
    ],
  },
  {
    name: 'Three-phase with a first-release clamp name (renamed to its DPWM name by 0004)',
    revisions: [
      {
        method: 'three-phase',
        parameters: {
          ma: 0.95,
          mf: 99,
          vdc: 650,
          zeroSequence: 'clamp-60-lag',
          sampling: 'regular-asymmetric',
          carrierPhase: 0,
          output: 'line-to-line',
        },
        load: { r: 3, l: 0.004, frequency: 50 },
        filter: null,
      },
      {
        method: 'three-phase',
        parameters: {
          ma: 0.95,
          mf: 99,
          vdc: 650,
          zeroSequence: 'clamp-120-bottom',
          sampling: 'natural',
          carrierPhase: 0,
          output: 'line-to-line',
        },
        load: { r: 3, l: 0.004, frequency: 50 },
        filter: null,
      },
    ],
    designs: [
      {
        vdc: 650,
        fundamentalFrequency: 50,
        carrierFrequency: 4950,
        modulation: {
          method: 'three-phase',
          ma: 0.95,
          zeroSequence: 'dpwm2',
          sampling: 'regular-asymmetric',
          carrierPhase: 0,
        },
        load: { r: 3, l: 0.004 },
      },
      {
        vdc: 650,
        fundamentalFrequency: 50,
        carrierFrequency: 4950,
        modulation: {
          method: 'three-phase',
          ma: 0.95,
          zeroSequence: 'dpwm-min',
          sampling: 'natural',
          carrierPhase: 0,
        },
        load: { r: 3, l: 0.004 },
      },
    ],
  },
  {
    name: 'Three-phase, output leg, then line-to-line, then restored',
    revisions: [
      {
        method: 'three-phase',
        parameters: {
          ma: 1.08,
          mf: 160,
          vdc: 650,
          zeroSequence: 'third-harmonic',
          sampling: 'natural',
          carrierPhase: 0,
          output: 'leg',
        },
        load: { r: 2.4, l: 0.0085, frequency: 50, emf: { amplitude: 180, phase: -0.2 } },
        filter: null,
      },
      {
        method: 'three-phase',
        parameters: {
          ma: 1.1,
          mf: 161,
          vdc: 650,
          zeroSequence: 'min-max',
          sampling: 'regular-symmetric',
          carrierPhase: 0,
          output: 'line-to-line',
        },
        load: { r: 2.4, l: 0.0085, frequency: 50 },
        filter: null,
      },
      {
        method: 'three-phase',
        parameters: {
          ma: 1.08,
          mf: 160,
          vdc: 650,
          zeroSequence: 'third-harmonic',
          sampling: 'natural',
          carrierPhase: 0,
          output: 'leg',
        },
        load: { r: 2.4, l: 0.0085, frequency: 50, emf: { amplitude: 180, phase: -0.2 } },
        filter: null,
        restoredFrom: 1,
      },
    ],
    designs: [
      {
        vdc: 650,
        fundamentalFrequency: 50,
        carrierFrequency: 8000,
        modulation: {
          method: 'three-phase',
          ma: 1.08,
          zeroSequence: 'third-harmonic',
          sampling: 'natural',
          carrierPhase: 0,
        },
        load: { r: 2.4, l: 0.0085, emf: { amplitude: 180, phase: -0.2 } },
      },
      {
        vdc: 650,
        fundamentalFrequency: 50,
        carrierFrequency: 8050,
        modulation: {
          method: 'three-phase',
          ma: 1.1,
          zeroSequence: 'min-max',
          sampling: 'regular-symmetric',
          carrierPhase: 0,
        },
        load: { r: 2.4, l: 0.0085 },
      },
      {
        vdc: 650,
        fundamentalFrequency: 50,
        carrierFrequency: 8000,
        modulation: {
          method: 'three-phase',
          ma: 1.08,
          zeroSequence: 'third-harmonic',
          sampling: 'natural',
          carrierPhase: 0,
        },
        load: { r: 2.4, l: 0.0085, emf: { amplitude: 180, phase: -0.2 } },
      },
    ],
  },
  {
    name: 'Space vector without a load (50 Hz by default)',
    revisions: [
      {
        method: 'space-vector',
        parameters: {
          m: 0.8,
          vdc: 600,
          frequencyRatio: 201,
          sequence: 'seven-segment',
          sampling: 'symmetric',
          zeroSplit: 0.5,
          clamping: 'dpwm1',
          overmodulation: 'two-mode',
          output: 'line-to-line',
        },
        load: null,
        filter: null,
      },
    ],
    designs: [
      {
        vdc: 600,
        fundamentalFrequency: 50,
        carrierFrequency: 10_050,
        modulation: {
          method: 'space-vector',
          m: 0.8,
          sequence: 'seven-segment',
          sampling: 'symmetric',
          zeroSplit: 0.5,
          clamping: 'dpwm1',
          overmodulation: 'two-mode',
        },
      },
    ],
  },
  {
    name: 'Harmonic-elimination pattern, filter with its own resistive load',
    revisions: [
      {
        method: 'selective-harmonic-elimination',
        parameters: {
          kind: 'bipolar',
          vdc: 200,
          angles: [0.2, 0.5, 0.9],
          eliminate: [5, 7],
          fundamental: 150,
        },
        load: null,
        filter: { l: 0.002, c: 0.00002, loadR: 12 },
      },
    ],
    designs: [
      {
        vdc: 200,
        fundamentalFrequency: 50,
        modulation: {
          method: 'selective-harmonic-elimination',
          kind: 'bipolar',
          angles: [0.2, 0.5, 0.9],
          eliminate: [5, 7],
          fundamental: 150,
        },
        filter: { l: 0.002, c: 0.00002 },
        load: { r: 12, l: 0 },
      },
    ],
  },
  {
    name: 'Bipolar with a load and a filter loadR (loadR left out of the design)',
    revisions: [
      {
        method: 'sine-triangle',
        parameters: {
          scheme: 'bipolar',
          ma: 0.8,
          mf: 21,
          vdc: 100,
          sampling: 'natural',
          carrierPhase: 0,
        },
        load: { r: 10, l: 0.02, frequency: 50 },
        filter: { l: 0.002, c: 0.00005, rDamping: 2, loadR: 30 },
      },
    ],
    designs: [
      {
        vdc: 100,
        fundamentalFrequency: 50,
        carrierFrequency: 1050,
        modulation: {
          method: 'sine-triangle',
          scheme: 'bipolar',
          ma: 0.8,
          sampling: 'natural',
          carrierPhase: 0,
        },
        filter: { l: 0.002, c: 0.00005, rDamping: 2 },
        load: { r: 10, l: 0.02 },
      },
    ],
  },
];

describe('migration 0002 on a database of the previous release', () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-migration-'));
  const file = path.join(dir, 'previous.sqlite');
  const ids = new Map<string, { studyId: string; revisionIds: string[] }>();
  let app: PulsewrightApp;
  let auth: { Authorization: string };
  let email: string;

  beforeAll(async () => {
    // The previous release: migration 0001 only, rows written as its services wrote them.
    const sequelize = await openDatabase(`sqlite:${file}`);
    const { applied } = await migrate(sequelize, '0001-initial-schema');
    expect(applied).toEqual(['0001-initial-schema']);
    const q = sequelize.getQueryInterface();
    const stamps = { createdAt: NOW, updatedAt: NOW };
    const teamId = randomUUID();
    const userId = randomUUID();
    const projectId = randomUUID();
    email = 'analyst@kestrel.example';
    await q.bulkInsert('teams', [{ id: teamId, name: 'Kestrel Drives', ...stamps }]);
    await q.bulkInsert('users', [
      {
        id: userId,
        email,
        name: 'Ravi Okafor',
        passwordHash: await bcrypt.hash(PASSWORD, 4),
        ...stamps,
      },
    ]);
    await q.bulkInsert('memberships', [
      { id: randomUUID(), teamId, userId, role: 'engineer', ...stamps },
    ]);
    await q.bulkInsert('projects', [
      {
        id: projectId,
        teamId,
        name: '3 kVA pump inverter',
        description: '',
        createdById: userId,
        ...stamps,
      },
    ]);
    for (const study of OLD_STUDIES) {
      const studyId = randomUUID();
      const last = study.revisions[study.revisions.length - 1] as OldRevision;
      await q.bulkInsert('studies', [
        {
          id: studyId,
          teamId,
          projectId,
          currentRevision: study.revisions.length,
          name: study.name,
          method: last.method,
          ...stamps,
        },
      ]);
      const revisionIds: string[] = [];
      for (const [k, revision] of study.revisions.entries()) {
        const id = randomUUID();
        revisionIds.push(id);
        await q.bulkInsert('study_revisions', [
          {
            id,
            studyId,
            revision: k + 1,
            name: study.name,
            method: revision.method,
            parameters: JSON.stringify(revision.parameters),
            load: revision.load === null ? null : JSON.stringify(revision.load),
            filter: revision.filter === null ? null : JSON.stringify(revision.filter),
            note: revision.note ?? '',
            authorId: userId,
            restoredFrom: revision.restoredFrom ?? null,
            ...stamps,
          },
        ]);
      }
      ids.set(study.name, { studyId, revisionIds });
    }
    await sequelize.close();

    // The new release starts on it: migration 0002 runs, nothing is seeded.
    app = await createApp({
      databaseUrl: `sqlite:${file}`,
      bcryptRounds: 4,
      logErrors: false,
      webDist: path.join(dir, 'none'),
    });
    auth = { Authorization: `Bearer ${await signIn(app, email, PASSWORD)}` };
  });

  afterAll(async () => {
    await app?.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('runs on a database that is not new, so nothing is seeded', async () => {
    expect(app.freshDatabase).toBe(false);
    const executed = await app.services.models.sequelize.query<{ name: string }>(
      'SELECT "name" FROM "schema_migrations" ORDER BY "name"',
      {
        type: QueryTypes.SELECT,
      },
    );
    expect(executed.map((m) => m.name)).toEqual([
      '0001-initial-schema',
      '0002-study-design',
      '0003-account-credentials',
      '0004-dpwm-names',
      '0005-credential-epoch',
    ]);
    expect(await app.services.models.User.count()).toBe(1);
  });

  for (const study of OLD_STUDIES) {
    it(`reads back "${study.name}" with its design and every old revision`, async () => {
      const { studyId } = ids.get(study.name)!;
      const current = await request(app).get(`/api/v1/studies/${studyId}`).set(auth);
      expect(current.status, JSON.stringify(current.body).slice(0, 400)).toBe(200);
      expect(current.body).toMatchObject({
        name: study.name,
        revision: study.revisions.length,
        method: study.revisions.at(-1)!.method,
      });
      expect(current.body.design).toEqual(study.designs.at(-1));

      const revisions = await request(app).get(`/api/v1/studies/${studyId}/revisions`).set(auth);
      expect(revisions.status).toBe(200);
      expect(revisions.body.map((r: { revision: number }) => r.revision)).toEqual(
        study.revisions.map((_, k) => study.revisions.length - k),
      );
      for (const [k, old] of study.revisions.entries()) {
        const row = revisions.body.find((r: { revision: number }) => r.revision === k + 1);
        expect(row.design, `revision ${k + 1}`).toEqual(study.designs[k]);
        expect(row).toMatchObject({
          note: old.note ?? '',
          authorEmail: email,
          restoredFrom: old.restoredFrom ?? null,
          createdAt: NOW.toISOString(),
        });
      }

      // The migrated design is one the library analyses (the report the dashboard reads).
      const report = await request(app)
        .get(`/api/v1/studies/${studyId}/report`)
        .query({ maxOrder: 50, points: 64 })
        .set(auth);
      expect(report.status, JSON.stringify(report.body).slice(0, 400)).toBe(200);
      expect(report.body.method).toBe(study.revisions.at(-1)!.method);
    });
  }

  it('keeps the old columns exactly as the previous release wrote them', async () => {
    for (const study of OLD_STUDIES) {
      const { revisionIds } = ids.get(study.name)!;
      for (const [k, old] of study.revisions.entries()) {
        const row = await app.services.models.StudyRevision.findByPk(revisionIds[k]);
        expect(row, `${study.name} revision ${k + 1}`).not.toBeNull();
        expect(row!.method).toBe(old.method);
        expect(row!.parameters).toEqual(old.parameters);
        expect(row!.load).toEqual(old.load);
        expect(row!.filter).toEqual(old.filter);
      }
    }
  });

  it('a migrated study is edited, restored and duplicated like any other', async () => {
    const drive = OLD_STUDIES.find((s) => s.name.startsWith('Three-phase, output leg'))!;
    const { studyId } = ids.get(drive.name)!;
    const design = {
      ...(drive.designs[0] as object),
      filter: { l: 0.0008, c: 0.00001, rDamping: 4 },
    };
    const edited = await request(app)
      .put(`/api/v1/studies/${studyId}`)
      .set(auth)
      .send({ baseRevision: 3, name: 'Drive, filtered', design });
    expect(edited.status, JSON.stringify(edited.body).slice(0, 400)).toBe(200);
    expect(edited.body).toMatchObject({ revision: 4, design });
    const restored = await request(app)
      .post(`/api/v1/studies/${studyId}/revisions/2/restore`)
      .set(auth)
      .send({ baseRevision: 4 });
    expect(restored.status).toBe(200);
    expect(restored.body.design).toEqual(drive.designs[1]);
    const copy = await request(app).post(`/api/v1/studies/${studyId}/duplicate`).set(auth).send({});
    expect(copy.status).toBe(201);
    expect(copy.body.design).toEqual(drive.designs[1]);
  });
});
