import {
  CARRIER_METHODS,
  EXAMPLE_IGBT,
  modulationPhaseCount,
  PATTERN_METHODS,
  spaceVectorIndices,
  type BridgeScheme,
  type CarrierSampling,
  type DampingPlacement,
  type DesignModulation,
  type IgbtDevice,
  type InverterDesign,
  type MosfetDevice,
  type ModulationMethod,
  type OvermodulationMethod,
  type SheKind,
  type SpaceVectorSampling,
  type SpaceVectorSequenceKind,
  type ZeroSequence,
  type ZeroVectorClamping,
} from '@pulsewright/modulation';
import {
  DEFAULT_MULTILEVEL_DRAFT,
  multilevelDraftOf,
  multilevelModulationOf,
  multilevelSpaceVectorDraftOf,
  multilevelSpaceVectorModulationOf,
  type MultilevelDraft,
} from './multilevelDraft.js';

/** A method given by stored first-quarter angles (picked on the elimination page, read-only here). */
export type PatternMethod = 'selective-harmonic-elimination' | 'optimal-pattern';

/** A stored pattern of first-quarter angles, kept as it was saved. */
export interface StoredPattern {
  method: PatternMethod;
  kind: SheKind;
  /** First-quarter switching angles, radians, ascending in (0, π/2). */
  angles: number[];
  /** Odd orders the angles were solved to eliminate (harmonic elimination only). */
  eliminate?: number[];
  /** Staircase of unequal cell sources: each cell's DC source, volts, one per angle. */
  cellVoltages?: number[];
  /** The fundamental the angles were solved for, peak volts (a record). */
  fundamental?: number;
}

/**
 * The editor's state: one {@link InverterDesign} spread into the fields the form shows, plus the
 * values of the parts that are switched off (so switching a method, a load or a filter back on
 * finds the values entered before). SI units throughout (volts, hertz, ohms, henries, farads,
 * radians); the form converts to mH, µF and degrees. A field may hold NaN while its text is not
 * a number: the library then refuses it and names the field.
 */
export interface StudyDraft {
  name: string;
  note: string;
  projectId: string;
  method: ModulationMethod;
  /** DC bus, volts. */
  vdc: number;
  /** Output frequency, hertz. */
  fundamentalFrequency: number;
  /** Carrier (switching period) frequency, hertz; the carrier methods only. */
  carrierFrequency: number;
  /** Modulation index ma (space vector: ma = 2m/√3). */
  ma: number;
  /** Carrier phase, radians (sine-triangle and three-phase carrier). */
  carrierPhase: number;
  scheme: BridgeScheme;
  sampling: CarrierSampling;
  zeroSequence: ZeroSequence;
  sequence: SpaceVectorSequenceKind;
  spaceVectorSampling: SpaceVectorSampling;
  /** Seven-segment share of the zero time on '000'. */
  zeroSplit: number;
  /** Five-segment zero-vector choice. */
  clamping: ZeroVectorClamping;
  /**
   * Whether the design keeps the clamping or the zero split while its sequence does not read
   * them (the library's space-vector options hold both, each read by one sequence): set where the
   * stored design has the field or the user picked it, so a save never drops it.
   */
  keepClamping: boolean;
  keepZeroSplit: boolean;
  overmodulation: OvermodulationMethod;
  /** The multilevel bridge's fields (methods `multilevel-carrier` and `multilevel-space-vector`). */
  multilevel: MultilevelDraft;
  /** The stored pattern of a pattern study (null for a study that never had one). */
  pattern: StoredPattern | null;
  loadOn: boolean;
  /** Load resistance, ohms; inductance, henries. */
  loadR: number;
  loadL: number;
  /** Back-EMF e = emf·sin(θ + emfPhase): peak volts and radians (0 V leaves it out). */
  emf: number;
  emfPhase: number;
  filterOn: boolean;
  /** Filter inductance, henries; capacitance, farads; damping resistance, ohms. */
  filterL: number;
  filterC: number;
  filterR: number;
  dampingPlacement: DampingPlacement;
  /** Blocking capacitance of the parallel R-C damping branch, farads. */
  cDamping: number;
  /** The bridge feeds a grid (through the filter as L1 and C) instead of the load. */
  gridOn: boolean;
  /** Grid voltage, volts rms line to line (three-phase) or rms; its phase a angle, radians. */
  gridLineVoltage: number;
  gridPhase: number;
  /** Grid resistance, ohms; grid inductance and grid-side inductor L2, henries. */
  gridR: number;
  gridL: number;
  gridL2: number;
  /** The current controller's bandwidth, hertz; 0 leaves it out. */
  gridControlBandwidth: number;
  /** The bridge generates power into the grid (IEEE 519's first row by its footnote); the design's `grid.generation`. */
  gridGeneration: boolean;
  /** The switching device the report's losses use: none, or which of the two below. */
  deviceKind: 'none' | SemiconductorDeviceKind;
  /** Datasheet values of each kind (volts, ohms, joules, amperes), kept while the other is chosen. */
  igbt: IgbtDevice;
  mosfet: MosfetDevice;
}

/** The kinds of switching device of the loss model. */
export type SemiconductorDeviceKind = 'igbt' | 'mosfet';

/** An invented MOSFET's datasheet-like values (not from any real part): the form's starting values. */
const STARTING_MOSFET: MosfetDevice = {
  kind: 'mosfet',
  rdsOn: 0.018,
  eon: 0.4e-3,
  eoff: 0.3e-3,
  err: 0.05e-3,
  referenceVoltage: 800,
  referenceCurrent: 50,
};

export function isPatternMethod(method: ModulationMethod): method is PatternMethod {
  return PATTERN_METHODS.includes(method);
}

export function isCarrierMethod(method: ModulationMethod): boolean {
  return CARRIER_METHODS.includes(method);
}

/** A new study: bipolar sine-triangle, 400 V, 50 Hz, carrier 1.05 kHz (mf 21), 10 Ω + 20 mH. */
export function defaultDraft(projectId = ''): StudyDraft {
  return {
    name: 'New study',
    note: '',
    projectId,
    method: 'sine-triangle',
    vdc: 400,
    fundamentalFrequency: 50,
    carrierFrequency: 1050,
    ma: 0.8,
    carrierPhase: 0,
    scheme: 'bipolar',
    sampling: 'natural',
    zeroSequence: 'none',
    sequence: 'seven-segment',
    spaceVectorSampling: 'symmetric',
    zeroSplit: 0.5,
    clamping: 'dpwm1',
    keepClamping: false,
    keepZeroSplit: false,
    overmodulation: 'two-mode',
    multilevel: { ...DEFAULT_MULTILEVEL_DRAFT },
    pattern: null,
    loadOn: true,
    loadR: 10,
    loadL: 0.02,
    emf: 0,
    emfPhase: 0,
    filterOn: false,
    filterL: 0.002,
    filterC: 20e-6,
    filterR: 0,
    dampingPlacement: 'series-with-capacitor',
    cDamping: 20e-6,
    gridOn: false,
    gridLineVoltage: 230,
    gridPhase: 0,
    gridR: 0.05,
    gridL: 0.0002,
    gridL2: 0.0005,
    gridControlBandwidth: 0,
    gridGeneration: true,
    deviceKind: 'none',
    igbt: { ...EXAMPLE_IGBT },
    mosfet: { ...STARTING_MOSFET },
  };
}

/** The modulation of a draft as a design holds it (without vdc and the frequency ratio). */
function designModulationOf(draft: StudyDraft): DesignModulation {
  const { method, ma } = draft;
  switch (method) {
    case 'sine-triangle':
      return {
        method,
        scheme: draft.scheme,
        ma,
        sampling: draft.sampling,
        carrierPhase: draft.carrierPhase,
      };
    case 'three-phase':
      return {
        method,
        ma,
        zeroSequence: draft.zeroSequence,
        sampling: draft.sampling,
        carrierPhase: draft.carrierPhase,
      };
    case 'space-vector':
      return {
        method,
        ma,
        sequence: draft.sequence,
        sampling: draft.spaceVectorSampling,
        ...(draft.sequence === 'seven-segment' || draft.keepZeroSplit
          ? { zeroSplit: draft.zeroSplit }
          : {}),
        ...(draft.sequence === 'five-segment' || draft.keepClamping
          ? { clamping: draft.clamping }
          : {}),
        overmodulation: draft.overmodulation,
      };
    case 'multilevel-carrier':
      return multilevelModulationOf(draft.multilevel, {
        ma,
        sampling: draft.sampling,
        carrierPhase: draft.carrierPhase,
      });
    case 'multilevel-space-vector':
      return multilevelSpaceVectorModulationOf(draft.multilevel, {
        ma,
        sampling: draft.spaceVectorSampling,
      });
    case 'selective-harmonic-elimination':
    case 'optimal-pattern': {
      // A pattern study keeps its stored pattern; without one the angles are empty and the library says so.
      const pattern = draft.pattern ?? { method, kind: 'bipolar', angles: [] };
      const fundamental =
        pattern.fundamental !== undefined ? { fundamental: pattern.fundamental } : {};
      if (method === 'optimal-pattern')
        return { method, kind: pattern.kind, angles: pattern.angles, ...fundamental };
      return {
        method,
        kind: pattern.kind,
        angles: pattern.angles,
        ...(pattern.cellVoltages ? { cellVoltages: pattern.cellVoltages } : {}),
        ...(pattern.eliminate ? { eliminate: pattern.eliminate } : {}),
        ...fundamental,
      };
    }
  }
}

/** How many phases the draft's bridge has (the library's answer for its modulation). */
export function draftPhaseCount(draft: StudyDraft): 1 | 3 {
  return modulationPhaseCount(designModulationOf(draft));
}

/** The {@link InverterDesign} a draft stands for: what the preview analyses and the save sends. */
export function designOf(draft: StudyDraft): InverterDesign {
  return {
    vdc: draft.vdc,
    fundamentalFrequency: draft.fundamentalFrequency,
    ...(isCarrierMethod(draft.method) ? { carrierFrequency: draft.carrierFrequency } : {}),
    modulation: designModulationOf(draft),
    filter: draft.filterOn
      ? {
          l: draft.filterL,
          c: draft.filterC,
          rDamping: draft.filterR,
          dampingPlacement: draft.dampingPlacement,
          ...(draft.dampingPlacement === 'parallel-rc' ? { cDamping: draft.cDamping } : {}),
        }
      : null,
    // A grid is what the bridge feeds: it replaces the load.
    load:
      draft.loadOn && !draft.gridOn
        ? {
            r: draft.loadR,
            l: draft.loadL,
            ...(draft.emf !== 0 || draft.emfPhase !== 0
              ? { emf: { amplitude: draft.emf, phase: draft.emfPhase } }
              : {}),
          }
        : null,
    ...(draft.gridOn
      ? {
          grid: {
            lineVoltage: draft.gridLineVoltage,
            phase: draft.gridPhase,
            r: draft.gridR,
            l: draft.gridL,
            l2: draft.gridL2,
            ...(draft.gridControlBandwidth > 0
              ? { controlBandwidth: draft.gridControlBandwidth }
              : {}),
            // Written only when it differs from the library's default (true).
            ...(draft.gridGeneration ? {} : { generation: false }),
          },
        }
      : {}),
    ...(draft.deviceKind === 'none' ? {} : { device: draft[draft.deviceKind] }),
  };
}

/** A space-vector modulation stored with m (scripts may send it) read as ma, by the library. */
function spaceVectorMa(m: number): number {
  try {
    return spaceVectorIndices({ m }).ma;
  } catch {
    // Out of range: keep the number so the library names the field when the preview runs.
    return m;
  }
}

/** The editor's state for a stored design (the fields the design leaves out keep their defaults). */
export function draftOf(
  design: InverterDesign,
  study: { name: string; note?: string | null; projectId: string },
): StudyDraft {
  const base = defaultDraft(study.projectId);
  const draft: StudyDraft = {
    ...base,
    name: study.name,
    note: study.note ?? '',
    method: design.modulation.method,
    vdc: design.vdc,
    fundamentalFrequency: design.fundamentalFrequency,
    carrierFrequency: design.carrierFrequency ?? base.carrierFrequency,
  };
  const modulation = design.modulation;
  switch (modulation.method) {
    case 'sine-triangle':
      Object.assign(draft, {
        scheme: modulation.scheme,
        ma: modulation.ma,
        sampling: modulation.sampling ?? base.sampling,
        carrierPhase: modulation.carrierPhase ?? 0,
      });
      break;
    case 'three-phase':
      Object.assign(draft, {
        ma: modulation.ma,
        zeroSequence: modulation.zeroSequence ?? base.zeroSequence,
        sampling: modulation.sampling ?? base.sampling,
        carrierPhase: modulation.carrierPhase ?? 0,
      });
      break;
    case 'space-vector':
      Object.assign(draft, {
        ma: modulation.ma ?? (modulation.m !== undefined ? spaceVectorMa(modulation.m) : base.ma),
        sequence: modulation.sequence ?? base.sequence,
        spaceVectorSampling: modulation.sampling ?? base.spaceVectorSampling,
        zeroSplit: modulation.zeroSplit ?? base.zeroSplit,
        clamping: modulation.clamping ?? base.clamping,
        keepZeroSplit: modulation.zeroSplit !== undefined,
        keepClamping: modulation.clamping !== undefined,
        overmodulation: modulation.overmodulation ?? base.overmodulation,
      });
      break;
    case 'multilevel-carrier':
      Object.assign(draft, {
        multilevel: multilevelDraftOf(modulation),
        ma: modulation.ma,
        sampling: modulation.sampling ?? base.sampling,
        carrierPhase: modulation.carrierPhase ?? 0,
      });
      break;
    case 'multilevel-space-vector':
      Object.assign(draft, {
        multilevel: multilevelSpaceVectorDraftOf(modulation),
        ma: modulation.ma ?? (modulation.m !== undefined ? spaceVectorMa(modulation.m) : base.ma),
        spaceVectorSampling: modulation.sampling ?? base.spaceVectorSampling,
      });
      break;
    case 'selective-harmonic-elimination':
    case 'optimal-pattern':
      draft.pattern = {
        method: modulation.method,
        kind: modulation.kind,
        angles: [...modulation.angles],
        ...(modulation.method === 'selective-harmonic-elimination' && modulation.eliminate
          ? { eliminate: [...modulation.eliminate] }
          : {}),
        ...(modulation.method === 'selective-harmonic-elimination' && modulation.cellVoltages
          ? { cellVoltages: [...modulation.cellVoltages] }
          : {}),
        ...(modulation.fundamental !== undefined ? { fundamental: modulation.fundamental } : {}),
      };
      break;
  }
  const { load, filter, grid, device } = design;
  if (device) Object.assign(draft, { deviceKind: device.kind, [device.kind]: { ...device } });
  if (grid) {
    Object.assign(draft, {
      gridOn: true,
      gridLineVoltage: grid.lineVoltage,
      gridPhase: grid.phase ?? 0,
      gridR: grid.r,
      gridL: grid.l,
      gridL2: grid.l2,
      gridControlBandwidth: grid.controlBandwidth ?? 0,
      gridGeneration: grid.generation ?? true,
    });
  }
  if (load) {
    Object.assign(draft, {
      loadOn: true,
      loadR: load.r,
      loadL: load.l,
      emf: load.emf?.amplitude ?? 0,
      emfPhase: load.emf?.phase ?? 0,
    });
  } else {
    draft.loadOn = false;
  }
  if (filter) {
    Object.assign(draft, {
      filterOn: true,
      filterL: filter.l,
      filterC: filter.c,
      filterR: filter.rDamping ?? 0,
      dampingPlacement: filter.dampingPlacement ?? base.dampingPlacement,
      cDamping: filter.cDamping ?? base.cDamping,
    });
  }
  return draft;
}

/** The study's own fields a save needs besides the design (empty name, no project). */
export function draftFormErrors(draft: StudyDraft): { field: string; message: string }[] {
  const errors: { field: string; message: string }[] = [];
  if (!draft.name.trim()) errors.push({ field: 'name', message: 'name must not be empty' });
  if (!draft.projectId)
    errors.push({ field: 'projectId', message: 'choose a project for the study' });
  return errors;
}
