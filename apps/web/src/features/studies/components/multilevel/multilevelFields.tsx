import {
  DESIGN_BOUNDS,
  MULTILEVEL_LEVEL_BOUNDS,
  THREE_LEVEL_SPACE_VECTOR_TOPOLOGIES,
} from '@pulsewright/modulation';
import { NumberField, SelectField } from '../../../../components/ui/Field';
import {
  labelOf,
  MULTILEVEL_CARRIER_OPTIONS,
  MULTILEVEL_TOPOLOGY_OPTIONS,
  MULTILEVEL_ZERO_SEQUENCE_OPTIONS,
  PHASE_COUNT_OPTIONS,
  SAMPLING_OPTIONS,
  SPACE_VECTOR_SAMPLING_OPTIONS,
} from '../../../../lib/modulationOptions';
import { rangeText } from '../../../../lib/fieldRange';
import {
  carriersOf,
  cellCountOf,
  withPhaseCount,
  withTopology,
  type MultilevelDraft,
} from '../../model/multilevelDraft';
import type { StudyDraft } from '../../model/studyDraft';
import type { StudyFieldErrors } from '../studyFieldErrors';

/** What each multilevel part of the fieldset is given: the draft, its change and the messages. */
interface MultilevelSection {
  draft: StudyDraft;
  onChange: (patch: Partial<StudyDraft>) => void;
  fields: StudyFieldErrors;
}

/** The hint under the levels: the topology's range and the cells it makes. */
function levelsHint(multilevel: MultilevelDraft): string {
  const { min, max, odd } = MULTILEVEL_LEVEL_BOUNDS[multilevel.topology];
  const cells = cellCountOf(multilevel);
  const range = `${odd ? 'odd, ' : ''}a whole number from ${min} to ${max}`;
  if (cells === null) return range;
  return multilevel.topology === 'cascaded-h-bridge'
    ? `${range}; ${cells} H-bridge cell${cells === 1 ? '' : 's'} a phase, (levels − 1)/2`
    : `${range}; ${cells} commutation cells, levels − 1`;
}

/**
 * The multilevel carrier method's fields of the study form's "Modulation" fieldset: topology,
 * levels (NPC and T-type legs are three-level by construction, so the field shows for flying
 * capacitor and cascaded bridges), the carrier arrangements the topology accepts, the phase
 * count, the zero sequence (three-phase only) and the sampling. A render function, as the
 * fieldset's other parts, so the messages it asks for are claimed before the unclaimed ones are
 * listed.
 */
export function multilevelFields({ draft, onChange, fields }: MultilevelSection) {
  const { error, limits } = fields;
  const { multilevel } = draft;
  const set = (next: MultilevelDraft) => onChange({ multilevel: next });
  const allowed = carriersOf(multilevel.topology);
  const { min, max } = MULTILEVEL_LEVEL_BOUNDS[multilevel.topology];
  const levels = limits(
    'modulation.levels',
    'Levels',
    multilevel.levels,
    {},
    {
      min,
      max,
      integer: true,
    },
  );
  return (
    <>
      <SelectField
        label="Topology"
        value={multilevel.topology}
        onValueChange={(topology) => set(withTopology(multilevel, topology))}
        error={error('modulation.topology')}
        options={MULTILEVEL_TOPOLOGY_OPTIONS}
      />
      {min === max ? null : (
        <NumberField
          label="Levels"
          value={multilevel.levels}
          hint={levelsHint(multilevel)}
          error={levels.error}
          onChange={(value) => set({ ...multilevel, levels: value })}
        />
      )}
      <SelectField
        label="Carriers"
        value={multilevel.carriers}
        onValueChange={(carriers) => set({ ...multilevel, carriers })}
        error={error('modulation.carriers')}
        options={allowed.map((value) => ({
          value,
          label: labelOf(MULTILEVEL_CARRIER_OPTIONS, value),
        }))}
      />
      <SelectField
        label="Phases"
        value={String(multilevel.phaseCount) as '1' | '3'}
        onValueChange={(count) => set(withPhaseCount(multilevel, count === '1' ? 1 : 3))}
        error={error('modulation.phaseCount')}
        options={PHASE_COUNT_OPTIONS}
      />
      {multilevel.phaseCount === 3 ? (
        <SelectField
          label="Zero sequence"
          value={multilevel.zeroSequence}
          onValueChange={(zeroSequence) => set({ ...multilevel, zeroSequence })}
          error={error('modulation.zeroSequence')}
          options={MULTILEVEL_ZERO_SEQUENCE_OPTIONS}
        />
      ) : null}
      <SelectField
        label="Sampling"
        value={draft.sampling}
        onValueChange={(sampling) => onChange({ sampling })}
        error={error('modulation.sampling')}
        options={SAMPLING_OPTIONS}
      />
    </>
  );
}

/** The topologies a three-level space-vector bridge takes (NPC and T-type), with the library's labels. */
const SPACE_VECTOR_TOPOLOGY_OPTIONS = THREE_LEVEL_SPACE_VECTOR_TOPOLOGIES.map((value) => ({
  value,
  label: labelOf(MULTILEVEL_TOPOLOGY_OPTIONS, value),
}));

/**
 * The three-level space-vector method's fields: the legs (NPC or T-type), the redundant small
 * vector's split (the lever on the neutral-point current, Celanovic and Boroyevich 2000) and the
 * space-vector sampling. A render function, as {@link multilevelFields}.
 */
export function multilevelSpaceVectorFields({ draft, onChange, fields }: MultilevelSection) {
  const { error, limits } = fields;
  const { multilevel } = draft;
  const split = limits(
    'modulation.smallVectorSplit',
    'Small-vector split',
    multilevel.smallVectorSplit,
  );
  return (
    <>
      <SelectField
        label="Topology"
        value={multilevel.spaceVectorTopology}
        onValueChange={(spaceVectorTopology) =>
          onChange({ multilevel: { ...multilevel, spaceVectorTopology } })
        }
        error={error('modulation.topology')}
        options={SPACE_VECTOR_TOPOLOGY_OPTIONS}
      />
      <NumberField
        label="Small-vector split"
        value={multilevel.smallVectorSplit}
        hint={`share of the redundant small vector's time on its P-type form, ${rangeText(DESIGN_BOUNDS['modulation.smallVectorSplit'])}; 0.5 splits it equally`}
        error={split.error}
        onChange={(smallVectorSplit) =>
          onChange({ multilevel: { ...multilevel, smallVectorSplit } })
        }
      />
      <SelectField
        label="Sampling"
        value={draft.spaceVectorSampling}
        onValueChange={(spaceVectorSampling) => onChange({ spaceVectorSampling })}
        error={error('modulation.sampling')}
        options={SPACE_VECTOR_SAMPLING_OPTIONS}
      />
    </>
  );
}
