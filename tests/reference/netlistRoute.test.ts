/**
 * The service's netlists read back (issue 15): POST /api/v1/netlists on the API's createApp (with
 * supertest, no port), its text read by the reader written from the SPICE user's guides
 * (packages/modulation/src/netlist/__tests__/spiceNetlist.ts: L. W. Nagel, SPICE2, UC Berkeley
 * ERL-M520, 1975; T. Quarles et al., SPICE3 Version 3f3 User's Manual, 1993; from memory), and
 * every ramp of every gate and leg checked against the library's own waveforms of the same
 * table (timerTableWaveforms): start to 1 ps, levels exactly, duration the rise or fall time.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { timerTable, type TimerTableOptions } from '@pulsewright/modulation';
import { DEMO, signIn, testApp, type TestApp } from '../../apps/api/src/__tests__/helpers.js';
import { expectNetlistOfTable } from '../../packages/modulation/src/netlist/__tests__/netlistChecks.js';

describe('POST /api/v1/netlists read back', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.viewer)}` };
  });
  afterAll(async () => t.dispose());

  const cases: { name: string; table: TimerTableOptions }[] = [
    {
      name: 'three-phase, min-max, centre-aligned, dead-time register',
      table: {
        modulation: { method: 'three-phase', zeroSequence: 'min-max', ma: 1.05 },
        fundamentalFrequency: 60,
        carrierFrequency: 4200,
        timerClock: 80e6,
        countingMode: 'centre-aligned',
        deadTime: 1.2e-6,
        deadTimeMethod: 'dead-time-register',
        vdc: 700,
      },
    },
    {
      name: 'unipolar H-bridge, asymmetric sampling, centre-aligned, compare offset',
      table: {
        modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.7 },
        fundamentalFrequency: 50,
        carrierFrequency: 5000,
        sampling: 'regular-asymmetric',
        timerClock: 64e6,
        countingMode: 'centre-aligned',
        deadTime: 4e-7,
        deadTimeMethod: 'compare-offset',
        vdc: 360,
      },
    },
  ];

  for (const { name, table } of cases) {
    it(`every edge of every gate and leg is the library's: ${name}`, async () => {
      const options = {
        riseTime: 4e-8,
        fallTime: 2.5e-8,
        periods: 2,
        gateVoltage: 12,
        currentAngle: 0.6,
      };
      const res = await request(t.app)
        .post('/api/v1/netlists')
        .set(auth)
        .send({ timerTable: table, ...options })
        .buffer(true)
        .parse((stream, done) => {
          let text = '';
          stream.setEncoding('utf8');
          stream.on('data', (chunk: string) => (text += chunk));
          stream.on('end', () => done(null, text));
        });
      expect(res.status, String(res.body)).toBe(200);
      const text = res.body as string;
      const library = timerTable(table);
      const netlist = expectNetlistOfTable(text, library, options);
      expect(netlist.sources).toHaveLength(3 * library.channels.length);
      // The check can fail: the same text is not the netlist of a load current in the other
      // direction (the leg voltages differ during dead time).
      expect(() =>
        expectNetlistOfTable(text, library, {
          ...options,
          currentAngle: options.currentAngle + Math.PI,
        }),
      ).toThrow();
    });
  }
});
