import {
  analyseDesign,
  threeLevelSpaceVectorTrajectory,
  threeLevelVectorDiagram,
  type InverterDesign,
} from '@pulsewright/modulation';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { reportCost } from '../services/cost.js';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

/**
 * The three-level space-vector diagram in the design report (issue 13): the service answers it
 * as the library draws it for a space-vector design, null for a carrier design, and the cost
 * model counts its trajectory (one sample a switching period) in the answer's size.
 */

/** A three-phase T-type bridge on an 800 V link, 36 switching periods a cycle (invented values). */
const SV_DESIGN = {
  vdc: 800,
  fundamentalFrequency: 50,
  carrierFrequency: 50 * 36,
  modulation: { method: 'multilevel-space-vector', m: 0.85, topology: 't-type' },
  load: { r: 6, l: 0.008 },
} as const satisfies InverterDesign;

describe('the three-level vector diagram in the service’s report', () => {
  let t: TestApp;
  let engineer: { Authorization: string };
  beforeAll(async () => {
    t = await testApp();
    engineer = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
  });
  afterAll(async () => t.dispose());

  it('POST /designs/report answers the library’s diagram and trajectory for a space-vector design', async () => {
    const res = await request(t.app)
      .post('/api/v1/designs/report')
      .set(engineer)
      .send({ design: SV_DESIGN, maxOrder: 100, points: 64 });
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(200);
    const { vectorDiagram } = res.body.multilevel;
    expect(vectorDiagram.diagram).toEqual(threeLevelVectorDiagram());
    expect(vectorDiagram.trajectory).toEqual(
      JSON.parse(JSON.stringify(threeLevelSpaceVectorTrajectory({ m: 0.85, frequencyRatio: 36 }))),
    );
    expect(vectorDiagram.trajectory).toHaveLength(36);
  });

  it('answers null for a multilevel carrier design', async () => {
    const design = {
      ...SV_DESIGN,
      modulation: {
        method: 'multilevel-carrier',
        topology: 'npc',
        levels: 3,
        carriers: 'pd',
        phaseCount: 3,
        ma: 0.9,
      },
    } as const satisfies InverterDesign;
    const res = await request(t.app)
      .post('/api/v1/designs/report')
      .set(engineer)
      .send({ design, maxOrder: 100, points: 64 });
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(200);
    expect(res.body.multilevel.vectorDiagram).toBeNull();
  });

  it('the cost model counts the trajectory: asymmetric sampling doubles it, within the measured size', () => {
    const options = { maxOrder: 100, points: 64 };
    const asymmetric = {
      ...SV_DESIGN,
      modulation: { ...SV_DESIGN.modulation, sampling: 'asymmetric' },
    } as const satisfies InverterDesign;
    const bytes = (design: InverterDesign) => reportCost(design, options).responseBytes;
    const trajectoryBytes = (design: InverterDesign) =>
      JSON.stringify(analyseDesign(design, options).multilevel?.vectorDiagram?.trajectory).length;
    // The estimate grows by at least the trajectory's extra 36 samples as JSON.
    expect(bytes(asymmetric) - bytes(SV_DESIGN)).toBeGreaterThanOrEqual(
      trajectoryBytes(asymmetric) - trajectoryBytes(SV_DESIGN),
    );
  });
});
