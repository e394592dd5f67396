import {
  designModulation,
  modulationVoltages,
  mulberry32,
  rlCurrentAt,
  TAU,
  waveformValueAt,
  type InverterDesign,
  type Waveform,
} from '@pulsewright/modulation';
import type { Role } from '../models/index.js';
import type { Services } from './index.js';
import type { Principal } from './principal.js';
import type { StudyContent } from './studies.js';

/** The invented demo team (docs/architecture.md, "Demo scenario"); every value below is made up. */
export const DEMO_USERS: readonly { email: string; name: string; role: Role }[] = [
  { email: 'admin@kestrel.example', name: 'Ada Marsh', role: 'admin' },
  { email: 'engineer@kestrel.example', name: 'Ravi Okafor', role: 'engineer' },
  { email: 'engineer2@kestrel.example', name: 'Lena Brandt', role: 'engineer' },
  { email: 'viewer@kestrel.example', name: 'Tomas Reyes', role: 'viewer' },
];

/** The pump motor at rated slip, modelled per phase as R–L (invented values). */
const PUMP_LOAD = { r: 15.5, l: 0.021 };

const PUMP_BASELINE: StudyContent = {
  name: 'Unipolar 20 kHz baseline',
  design: {
    vdc: 375,
    fundamentalFrequency: 50,
    carrierFrequency: 20_000,
    modulation: {
      method: 'sine-triangle',
      scheme: 'unipolar',
      ma: 0.86,
      sampling: 'natural',
      carrierPhase: 0,
    },
    filter: { l: 0.0011, c: 0.0000068, rDamping: 2.2, dampingPlacement: 'series-with-capacitor' },
    load: PUMP_LOAD,
  },
  note: 'Pump motor modelled as RL at the rated slip; filter sized for about 1.8 kHz resonance.',
};

/** The bench capture is taken at a low frequency ratio (42) so its pulses are visible at 250 kS/s. */
const BENCH_DESIGN: InverterDesign = {
  vdc: 360,
  fundamentalFrequency: 50,
  carrierFrequency: 2100,
  modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.8 },
  load: { r: 12, l: 0.018 },
};

/**
 * The 7.5 kW drive's motor at rated load as an equivalent R–L per phase (star), invented: about
 * 13.6 A rms and 8.9 kW drawn at ma 1.1 from 650 V, i.e. 7.5 kW at the shaft at 85 % efficiency.
 */
const DRIVE_LOAD = { r: 16, l: 0.03 };

/**
 * Seeds a new database with the Kestrel Drives scenario: the team, four people sharing the
 * demo password, two projects, a few studies with history, and one bench capture.
 */
export async function seedDemo(services: Services, password: string): Promise<void> {
  const { models, auth, projects, studies, captures } = services;
  const passwordHash = await auth.hashPassword(password);
  const team = await models.Team.create({ name: 'Kestrel Drives' });
  const principals: Principal[] = [];
  for (const person of DEMO_USERS) {
    const user = await models.User.create({ email: person.email, name: person.name, passwordHash });
    await models.Membership.create({ teamId: team.id, userId: user.id, role: person.role });
    principals.push({
      user: { id: user.id, email: user.email, name: user.name },
      teamId: team.id,
      teamName: team.name,
      role: person.role,
      authMethod: 'session',
      credentialId: 'seed',
    });
  }
  const [, ravi, lena] = principals as [Principal, Principal, Principal, Principal];

  const pump = await projects.create(ravi, {
    name: '3 kVA pump inverter',
    description:
      'Single-phase H-bridge for irrigation pumps: 230 V rms, 50 Hz output from a 375 V bus.',
  });
  const drive = await projects.create(lena, {
    name: '7.5 kW drive',
    description: 'Three-phase drive for a 400 V induction motor from a 650 V bus.',
  });

  const baseline = await studies.create(ravi, pump.id, PUMP_BASELINE);
  // A second revision: the team settled on a slightly higher index after a bus-voltage review.
  await studies.update(ravi, baseline.id, baseline.revision, {
    ...PUMP_BASELINE,
    design: {
      ...PUMP_BASELINE.design,
      modulation: { ...PUMP_BASELINE.design.modulation, ma: 0.88 } as InverterDesign['modulation'],
    },
    note: `${PUMP_BASELINE.note} Index raised to 0.88 for the low-line case.`,
  });
  await studies.create(ravi, pump.id, {
    name: 'Bipolar comparison',
    design: {
      vdc: 375,
      fundamentalFrequency: 50,
      carrierFrequency: 19_950,
      modulation: {
        method: 'sine-triangle',
        scheme: 'bipolar',
        ma: 0.88,
        sampling: 'natural',
        carrierPhase: 0,
      },
      filter: null,
      load: PUMP_LOAD,
    },
    note: 'Two-level switching for comparison: simpler gate drive, larger ripple.',
  });
  await studies.create(lena, drive.id, {
    name: 'Third-harmonic injection, 8 kHz',
    design: {
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
      load: DRIVE_LOAD,
    },
    note: 'Linear up to ma ≈ 1.15 with 1/6 third-harmonic injection.',
  });
  await studies.create(lena, drive.id, {
    name: 'Centred space vector (min-max), 8 kHz',
    design: {
      vdc: 650,
      fundamentalFrequency: 50,
      carrierFrequency: 8000,
      modulation: {
        method: 'three-phase',
        ma: 1.1,
        zeroSequence: 'min-max',
        sampling: 'regular-symmetric',
        carrierPhase: 0,
      },
      load: DRIVE_LOAD,
    },
    note: 'Regular-symmetric sampling as the controller will run it.',
  });
  await studies.create(ravi, pump.id, {
    name: 'Bench prototype (42 × 50 Hz carrier)',
    design: BENCH_DESIGN,
    note: 'Settings of the first bench prototype, for comparison with the capture.',
  });

  const csv = benchCaptureCsv();
  await captures.upload(
    ravi,
    { buffer: Buffer.from(csv, 'utf8'), originalname: 'kestrel-bench-prototype-run1.csv' },
    {
      name: 'Bench prototype, run 1',
      projectId: pump.id,
    },
  );
}

/**
 * An invented bench capture: two 50 Hz periods of the bench prototype's bridge voltage and
 * load current sampled at 250 kS/s, with a little measurement noise. Voltage and current come
 * from the library (waveformValueAt, rlCurrentAt).
 */
export function benchCaptureCsv(): string {
  const sampleRate = 250_000;
  const frequency = BENCH_DESIGN.fundamentalFrequency;
  const rows = (2 * sampleRate) / frequency;
  const waveform = modulationVoltages(designModulation(BENCH_DESIGN)).phases[0]
    ?.waveform as Waveform;
  const angles = Array.from({ length: rows }, (_, k) => ((TAU * frequency * k) / sampleRate) % TAU);
  const current = rlCurrentAt(waveform, angles, {
    ...(BENCH_DESIGN.load as { r: number; l: number }),
    frequency,
  });
  // The library's seeded generator, so every new database gets the same capture.
  const random = mulberry32(0x6b657374); // "kest"
  const noise = (scale: number) => (random() + random() + random() - 1.5) * scale;
  const lines = ['time_s,voltage_v,current_a'];
  for (let k = 0; k < rows; k++) {
    const v = waveformValueAt(waveform, angles[k] as number) + noise(1.5);
    const i = (current[k] as number) + noise(0.02);
    lines.push(`${(k / sampleRate).toFixed(7)},${v.toFixed(2)},${i.toFixed(4)}`);
  }
  return `${lines.join('\n')}\n`;
}
