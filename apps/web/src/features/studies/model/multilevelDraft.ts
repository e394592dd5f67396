import {
  MULTILEVEL_CARRIERS_BY_TOPOLOGY,
  MULTILEVEL_LEVEL_BOUNDS,
  type MultilevelCarrierArrangement,
  type MultilevelCarrierModulation,
  type MultilevelSpaceVectorModulation,
  type MultilevelTopology,
  type MultilevelZeroSequence,
  type ThreeLevelSpaceVectorTopology,
} from '@pulsewright/modulation';

/**
 * The editor's multilevel fields. Method `multilevel-carrier`: the topology, the levels of a leg
 * (of a string for a cascaded bridge), the carrier arrangement, the phase count and the zero
 * sequence; the modulation index, sampling and carrier phase are the draft's shared carrier
 * fields. Method `multilevel-space-vector`: its own topology (NPC or T-type) and the redundant
 * small vector's split; ma and the space-vector sampling are the draft's shared fields.
 */
export interface MultilevelDraft {
  topology: MultilevelTopology;
  /** Levels of a leg (a cascaded string: 2·cells + 1); NaN while the text is not a number. */
  levels: number;
  carriers: MultilevelCarrierArrangement;
  phaseCount: 1 | 3;
  zeroSequence: MultilevelZeroSequence;
  /** The three-level space-vector bridge's legs, kept apart from the carrier method's topology. */
  spaceVectorTopology: ThreeLevelSpaceVectorTopology;
  /** Share of the redundant small vector's dwell on its P-type form, [0, 1]. */
  smallVectorSplit: number;
}

/** A multilevel space-vector modulation as a design holds it. */
type DesignMultilevelSpaceVector = Omit<MultilevelSpaceVectorModulation, 'vdc' | 'frequencyRatio'>;

/** A new multilevel design: a three-phase three-level NPC bridge, PD carriers, sine references. */
export const DEFAULT_MULTILEVEL_DRAFT: MultilevelDraft = {
  topology: 'npc',
  levels: 3,
  carriers: 'pd',
  phaseCount: 3,
  zeroSequence: 'none',
  spaceVectorTopology: 'npc',
  smallVectorSplit: 0.5,
};

/** The carrier arrangements the topology accepts, in the library's order. */
export function carriersOf(topology: MultilevelTopology): readonly MultilevelCarrierArrangement[] {
  return MULTILEVEL_CARRIERS_BY_TOPOLOGY[topology];
}

/**
 * The fields after a change of topology: the arrangement kept if the new topology accepts it
 * (else its first), the levels kept if they are within its range (else its lowest), so the form
 * never offers a pair the library refuses.
 */
export function withTopology(
  draft: MultilevelDraft,
  topology: MultilevelTopology,
): MultilevelDraft {
  const allowed = carriersOf(topology);
  const { min, max } = MULTILEVEL_LEVEL_BOUNDS[topology];
  return {
    ...draft,
    topology,
    carriers: allowed.includes(draft.carriers) ? draft.carriers : (allowed[0] ?? draft.carriers),
    levels: draft.levels >= min && draft.levels <= max ? draft.levels : min,
  };
}

/** The fields after a change of phase count: a single-phase bridge takes no zero sequence. */
export function withPhaseCount(draft: MultilevelDraft, phaseCount: 1 | 3): MultilevelDraft {
  return { ...draft, phaseCount, zeroSequence: phaseCount === 1 ? 'none' : draft.zeroSequence };
}

/** The design's multilevel modulation (without the DC bus and frequency ratio, which the design holds). */
export function multilevelModulationOf(
  draft: MultilevelDraft,
  shared: Pick<MultilevelCarrierModulation, 'ma' | 'sampling' | 'carrierPhase'>,
): Omit<MultilevelCarrierModulation, 'vdc' | 'mf'> {
  return {
    method: 'multilevel-carrier',
    topology: draft.topology,
    levels: draft.levels,
    carriers: draft.carriers,
    phaseCount: draft.phaseCount,
    zeroSequence: draft.zeroSequence,
    ...shared,
  };
}

/** The design's three-level space-vector modulation (the design holds vdc and the frequency ratio). */
export function multilevelSpaceVectorModulationOf(
  draft: MultilevelDraft,
  shared: Pick<DesignMultilevelSpaceVector, 'ma' | 'sampling'>,
): DesignMultilevelSpaceVector {
  return {
    method: 'multilevel-space-vector',
    topology: draft.spaceVectorTopology,
    smallVectorSplit: draft.smallVectorSplit,
    ...shared,
  };
}

/** The editor's fields of a stored three-level space-vector modulation (ma is the caller's). */
export function multilevelSpaceVectorDraftOf(
  modulation: DesignMultilevelSpaceVector,
): MultilevelDraft {
  return {
    ...DEFAULT_MULTILEVEL_DRAFT,
    spaceVectorTopology: modulation.topology ?? DEFAULT_MULTILEVEL_DRAFT.spaceVectorTopology,
    smallVectorSplit: modulation.smallVectorSplit ?? DEFAULT_MULTILEVEL_DRAFT.smallVectorSplit,
  };
}

/** The editor's fields of a stored multilevel modulation (what it leaves out keeps the defaults). */
export function multilevelDraftOf(
  modulation: Omit<MultilevelCarrierModulation, 'vdc' | 'mf'>,
): MultilevelDraft {
  return {
    ...DEFAULT_MULTILEVEL_DRAFT,
    topology: modulation.topology,
    levels: modulation.levels,
    carriers: modulation.carriers,
    phaseCount: modulation.phaseCount,
    zeroSequence: modulation.zeroSequence ?? DEFAULT_MULTILEVEL_DRAFT.zeroSequence,
  };
}

/**
 * The cells a leg of that many levels has, for the form's hint: a cascaded string's H-bridge
 * cells (levels − 1)/2, a flying-capacitor leg's commutation cells levels − 1; null for the
 * three-level NPC and T-type legs and for levels that make no whole cell count.
 */
export function cellCountOf({ topology, levels }: MultilevelDraft): number | null {
  if (!Number.isInteger(levels)) return null;
  if (topology === 'cascaded-h-bridge') return levels % 2 === 1 ? (levels - 1) / 2 : null;
  if (topology === 'flying-capacitor') return levels - 1;
  return null;
}
