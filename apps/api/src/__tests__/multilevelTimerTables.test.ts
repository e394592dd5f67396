import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { multilevelTimerTable, type MultilevelTimerTable } from '@pulsewright/modulation';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

/** A single-phase NPC full bridge, POD carriers, 50 Hz at 5.05 kHz on a 72 MHz timer. */
const NPC_TABLE = {
  modulation: {
    topology: 'npc',
    levels: 3,
    carriers: 'pod',
    phaseCount: 1,
    ma: 0.9,
    vdc: 800,
  },
  fundamentalFrequency: 50,
  carrierFrequency: 5050,
  timerClock: 72e6,
  deadTime: 1e-6,
} as const;

function hasCompiler(): boolean {
  try {
    execFileSync('cc', ['--version'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

interface Problem {
  detail: string;
  errors: { path: string; message: string }[];
}

describe('POST /api/v1/multilevel-timer-tables', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.viewer)}` };
  });
  afterAll(async () => t.dispose());

  it('answers a viewer with the table as JSON, CSV and a C header that compiles', async () => {
    const expected = {
      json: [/^application\/json/, 'inverter_leg.json'],
      csv: [/^text\/csv/, 'inverter_leg.csv'],
      'c-header': [/^text\/x-c/, 'inverter_leg.h'],
    } as const;
    for (const [format, [type, file]] of Object.entries(expected)) {
      const res = await request(t.app)
        .post('/api/v1/multilevel-timer-tables')
        .query({ format })
        .set(auth)
        .send({ ...NPC_TABLE, prefix: 'inverter_leg' })
        .buffer(true);
      expect(res.status, res.text).toBe(200);
      expect(res.headers['content-type']).toMatch(type);
      expect(res.headers['content-disposition']).toBe(`attachment; filename="${file}"`);
      if (format === 'json') {
        const table = JSON.parse(res.text) as MultilevelTimerTable;
        // Centre-aligned: P = f_clk/(2·f_c) = 72 MHz / 10.1 kHz = 7128.7 → 7129 (common practice,
        // from memory); 1 µs at 72 MHz is 72 ticks.
        expect(table.periodRegister).toBe(7129);
        expect(table.deadTimeCounts).toBe(72);
        expect(table.legs.map((l) => l.name)).toEqual(['leg a', 'leg b']);
        expect(table.legs[0]!.pairs.map((p) => `${p.main}/${p.complement}`)).toEqual([
          'S1/S3',
          'S2/S4',
        ]);
        // The upper band's pair S1/S3 holds max(0, ma·sin θ)·P at each sampling angle (level-shifted
        // carriers, McGrath and Holmes 2002; Holmes and Lipo 2003 ch. 11).
        const s1 = table.legs[0]!.pairs[0]!;
        table.counters[s1.counter]!.entryAngles.forEach((theta, i) => {
          expect(s1.compare[i]).toBe(Math.round(7129 * Math.max(0, 0.9 * Math.sin(theta))));
        });
        // The service answers what the library computes, to the last digit.
        expect(table).toEqual(
          JSON.parse(JSON.stringify(multilevelTimerTable({ ...NPC_TABLE }))) as unknown,
        );
      }
      if (format === 'csv') {
        expect(res.text.split('\r\n')[0]).toContain('leg_a_S1_duty');
        expect(res.text.trimEnd().split('\r\n')).toHaveLength(101 + 1);
      }
      if (format === 'c-header') {
        expect(res.text).toContain('static const uint16_t inverter_leg_b_s4[INVERTER_LEG_LENGTH]');
        if (hasCompiler()) {
          const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-ml-h-'));
          try {
            writeFileSync(path.join(dir, 'inverter_leg.h'), res.text);
            writeFileSync(
              path.join(dir, 'main.c'),
              '#include "inverter_leg.h"\nint main(void) { return (int)(inverter_leg_a_s1[0] + inverter_leg_counter_offset[1]) * 0; }\n',
            );
            execFileSync('cc', [
              '-std=c99',
              '-Wall',
              '-Werror',
              '-fsyntax-only',
              path.join(dir, 'main.c'),
            ]);
          } finally {
            rmSync(dir, { recursive: true, force: true });
          }
        }
      }
    }
  });

  it('refuses without a sign-in', async () => {
    const res = await request(t.app).post('/api/v1/multilevel-timer-tables').send(NPC_TABLE);
    expect(res.status).toBe(401);
  });

  const refusals: { name: string; body: object; field: string; words: string[] }[] = [
    {
      name: 'levels the topology does not have (the library names it)',
      body: { ...NPC_TABLE, modulation: { ...NPC_TABLE.modulation, levels: 5 } },
      field: 'modulation.levels',
      words: ["3 for topology 'npc'"],
    },
    {
      name: 'natural sampling (a timer holds one compare value per update)',
      body: { ...NPC_TABLE, modulation: { ...NPC_TABLE.modulation, sampling: 'natural' } },
      field: 'modulation.sampling',
      words: ['regular-symmetric'],
    },
    {
      name: 'an edge-aligned counter',
      body: { ...NPC_TABLE, countingMode: 'edge-aligned' },
      field: 'countingMode',
      words: ['centre-aligned'],
    },
    {
      name: 'a carrier that is not a whole multiple of the fundamental',
      body: { ...NPC_TABLE, carrierFrequency: 5060 },
      field: 'carrierFrequency/fundamentalFrequency',
      words: ['an integer from 1 to 10000'],
    },
    {
      name: 'compare-offset dead time on level-shifted bands',
      body: { ...NPC_TABLE, deadTimeMethod: 'compare-offset' },
      field: 'deadTimeMethod',
      words: ["'dead-time-register' for this modulation", 'counter peak'],
    },
    {
      name: 'a prefix that is not a C identifier',
      body: { ...NPC_TABLE, prefix: '9leg' },
      field: 'prefix',
      words: [],
    },
  ];
  for (const c of refusals) {
    it(`answers 400 naming ${c.field}: ${c.name}`, async () => {
      const res = await request(t.app)
        .post('/api/v1/multilevel-timer-tables')
        .set(auth)
        .send(c.body);
      expect(res.status, res.text).toBe(400);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      const problem = res.body as Problem;
      const item = problem.errors.find((e) => e.path === c.field);
      expect(item, JSON.stringify(problem.errors)).toBeDefined();
      for (const word of c.words) expect(item!.message).toContain(word);
    });
  }
});

describe('POST /api/v1/multilevel-timer-tables: priced before any work', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  beforeAll(async () => {
    t = await testApp({ compute: { responseBytesBudget: 1e6 } });
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.viewer)}` };
  });
  afterAll(async () => t.dispose());

  /** Cascaded, 17 levels, three-phase: 48 complementary pairs. */
  const LARGE = {
    modulation: {
      topology: 'cascaded-h-bridge',
      levels: 17,
      carriers: 'phase-shifted',
      phaseCount: 3,
      ma: 0.9,
      vdc: 600,
      sampling: 'regular-asymmetric',
    },
    fundamentalFrequency: 0.1,
    carrierFrequency: 1000,
    timerClock: 1e8,
  } as const;

  it('refuses a default table length past the budgets at once, naming the fields, and goes on', async () => {
    // mf 10 000, asymmetric: 20 000 rows × 48 pairs, about 4·10⁸ units of work.
    const started = performance.now();
    const res = await request(t.app).post('/api/v1/multilevel-timer-tables').set(auth).send(LARGE);
    expect(res.status, res.text).toBe(400);
    const problem = res.body as Problem;
    expect(problem.errors.map((e) => e.path).sort()).toEqual(
      ['carrierFrequency', 'fundamentalFrequency', 'modulation.levels', 'tableLength'].sort(),
    );
    expect(problem.detail).toContain('20000 rows × 48 complementary pairs');
    expect(problem.detail).toContain('COMPUTE_WORK_BUDGET');
    expect(performance.now() - started).toBeLessThan(1000);
    expect((await request(t.app).get('/api/health')).status).toBe(200);
  });

  it('bounds the answer: 500 rows × 48 pairs is over 1 MB as JSON, not as a C header', async () => {
    const body = { ...LARGE, tableLength: 500 };
    const json = await request(t.app).post('/api/v1/multilevel-timer-tables').set(auth).send(body);
    expect(json.status, json.text).toBe(400);
    const problem = json.body as Problem;
    expect(problem.errors.map((e) => e.path)).toContain('tableLength');
    expect(problem.detail).toContain('RESPONSE_BYTES_BUDGET');
    const header = await request(t.app)
      .post('/api/v1/multilevel-timer-tables?format=c-header')
      .set(auth)
      .send(body);
    expect(header.status, header.text).toBe(200);
    expect(header.text.length).toBeLessThan(1e6);
  });
});
