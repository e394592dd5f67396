import type { CarrierSpan } from '../carrier/CarrierSpan.js';
import { sineTriangle } from '../carrier/sineTriangle.js';
import { multilevelCarrier } from '../multilevel/carrier/multilevelCarrier.js';
import { threeLevelSpaceVectorWaveforms } from '../multilevel/space-vector/threeLevelSpaceVectorWaveforms.js';
import type { MultilevelTopology, MultilevelWaveforms } from '../multilevel/MultilevelTypes.js';
import { sheWaveform } from '../she/sheWaveform.js';
import { spaceVectorLegs } from '../space-vector/spaceVectorWaveforms.js';
import { starVoltages } from '../three-phase/starVoltages.js';
import { threePhaseLegs } from '../three-phase/threePhase.js';
import { combineWaveforms } from '../waveform/combineWaveforms.js';
import type { Waveform } from '../waveform/Waveform.js';
import type { Modulation } from './Modulation.js';

/** A voltage waveform with a name that says what it is measured between. */
export interface NamedVoltage {
  /** For example `bridge output`, `leg a to DC midpoint`, `phase a to star point`, `line a−b`. */
  name: string;
  /** One fundamental period, volts (or the span of q periods when one is asked for). */
  waveform: Waveform;
}

/** The output voltages of a modulated bridge, named by what they are. */
export interface ModulationVoltages {
  /** 1 for a single-phase bridge, 3 for a three-phase bridge. */
  phaseCount: 1 | 3;
  /**
   * The voltage across each phase of the load: the bridge output of a single-phase bridge, or
   * each phase to the star point of a balanced star load, v_an = (2·v_a − v_b − v_c)/3 of the leg
   * voltages (standard circuit analysis). One entry per phase, a, b, c.
   */
  phases: NamedVoltage[];
  /**
   * Leg to DC-midpoint voltages, or a cascaded string's to its neutral end (three-phase only;
   * empty for a single-phase bridge).
   */
  legs: NamedVoltage[];
  /** Line-to-line voltages a−b, b−c, c−a (three-phase only). */
  lines: NamedVoltage[];
  /**
   * Three-phase only (null for a single-phase bridge): the star point of a balanced star load
   * to the legs' reference, (v_a + v_b + v_c)/3 (volts).
   */
  commonMode: Waveform | null;
  /** A multilevel bridge's legs (strings), their switches and cells, as its method built them. */
  multilevel?: MultilevelWaveforms & { topology: MultilevelTopology };
}

const PHASE_NAMES = ['a', 'b', 'c'] as const;

/**
 * Builds the output voltages of a {@link Modulation} with the library function of its method,
 * exact (no time step), and names each by what it is measured between. With `span` (q
 * fundamental periods, the carrier methods at mf = p/q) the waveforms cover the whole span;
 * space vector finds its span from its own frequencyRatio.
 * @throws ParameterRangeError / ParameterTypeError from the method's function, naming its field
 */
export function modulationVoltages(
  modulation: Modulation,
  span: CarrierSpan = {},
): ModulationVoltages {
  switch (modulation.method) {
    case 'sine-triangle': {
      const { method: _method, ...options } = modulation;
      return singlePhase('bridge output', sineTriangle(options, span));
    }
    case 'selective-harmonic-elimination':
    case 'optimal-pattern': {
      const waveform = sheWaveform(modulation.angles, {
        kind: modulation.kind,
        vdc: modulation.vdc,
        cellVoltages: modulation.cellVoltages,
      });
      return singlePhase(
        modulation.kind === 'staircase' ? 'staircase output' : 'bridge output',
        waveform,
      );
    }
    case 'three-phase': {
      const { method: _method, ...options } = modulation;
      const legs = threePhaseLegs(options, span);
      return threePhaseVoltages([legs.a, legs.b, legs.c]);
    }
    case 'space-vector': {
      const { method: _method, ...options } = modulation;
      const legs = spaceVectorLegs(options);
      return threePhaseVoltages([legs.a, legs.b, legs.c]);
    }
    case 'multilevel-carrier': {
      const { method: _method, ...options } = modulation;
      return multilevelVoltages(multilevelCarrier(options), modulation.topology);
    }
    case 'multilevel-space-vector': {
      const { method: _method, ...options } = modulation;
      return multilevelVoltages(
        threeLevelSpaceVectorWaveforms(options),
        modulation.topology ?? 'npc',
      );
    }
  }
}

/**
 * A multilevel bridge's voltages: three legs (strings) in star as a two-level three-phase
 * bridge's, each leg named `leg a to DC midpoint` (a cascaded string `string a to its neutral`);
 * a single-phase `bridge output`, leg a − leg b of a full bridge or the one cascaded string.
 */
function multilevelVoltages(
  waveforms: MultilevelWaveforms,
  topology: MultilevelTopology,
): ModulationVoltages {
  const outputs = waveforms.legs.map((leg) => leg.output);
  const multilevel = { ...waveforms, topology };
  if (waveforms.phaseCount === 3) {
    const legName =
      topology === 'cascaded-h-bridge'
        ? (p: string) => `string ${p} to its neutral`
        : (p: string) => `leg ${p} to DC midpoint`;
    return {
      ...threePhaseVoltages(outputs as [Waveform, Waveform, Waveform], legName),
      multilevel,
    };
  }
  const [a, b] = outputs as [Waveform, Waveform | undefined];
  const output =
    b === undefined ? a : combineWaveforms([a, b], ([own = 0, other = 0]) => own - other);
  return { ...singlePhase('bridge output', output), multilevel };
}

function singlePhase(name: string, waveform: Waveform): ModulationVoltages {
  return { phaseCount: 1, phases: [{ name, waveform }], legs: [], lines: [], commonMode: null };
}

/**
 * Three legs in star: each phase to the star point, each line and the common mode, combined
 * exactly (`starVoltages`).
 */
function threePhaseVoltages(
  legs: [Waveform, Waveform, Waveform],
  legName = (phase: string): string => `leg ${phase} to DC midpoint`,
): ModulationVoltages {
  const star = starVoltages(legs);
  return {
    phaseCount: 3,
    legs: PHASE_NAMES.map((p, k) => ({ name: legName(p), waveform: legs[k] as Waveform })),
    phases: PHASE_NAMES.map((p, k) => ({
      name: `phase ${p} to star point`,
      waveform: star.phases[k] as Waveform,
    })),
    lines: PHASE_NAMES.map((p, k) => ({
      name: `line ${p}−${PHASE_NAMES[(k + 1) % 3]}`,
      waveform: star.lines[k] as Waveform,
    })),
    commonMode: star.commonMode,
  };
}
