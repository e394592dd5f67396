import { filterInductanceForTarget } from '@pulsewright/modulation';
import { useState } from 'react';
import { NumberField, SelectField } from '../../../components/ui/Field';
import { rangeError } from '../../../lib/fieldRange';
import type { StudyDraft } from '../model/studyDraft';

type SizingKind = 'typed' | 'resonance' | 'ripple';

const TARGET_BOUNDS = { min: 0, minExclusive: true };

const TARGETS = {
  resonance: {
    label: 'Resonance target',
    unit: 'Hz',
    hint: 'the LC resonance, the usual cut-off figure',
  },
  ripple: {
    label: 'Ripple target',
    unit: 'A peak-to-peak',
    hint: 'inductor current ripple, two-level worst case at the DC bus and carrier above',
  },
} as const;

/**
 * Sizing the filter inductance from a target instead of typing it: a resonance (cut-off) in Hz
 * or a peak-to-peak ripple in amperes, by the library's `filterInductanceForTarget`. The L it
 * gives is written into the Filter L field, so that field still shows what will be saved.
 */
export function FilterSizing({
  draft,
  onChange,
  carrier,
}: {
  draft: StudyDraft;
  onChange: (patch: Partial<StudyDraft>) => void;
  /** Whether the method has a carrier (a ripple target needs one). */
  carrier: boolean;
}) {
  const [kind, setKind] = useState<SizingKind>('typed');
  const [target, setTarget] = useState(Number.NaN);
  const [problem, setProblem] = useState<string | undefined>(undefined);
  const size = (nextKind: SizingKind, value: number) => {
    setTarget(value);
    if (nextKind === 'typed') return setProblem(undefined);
    const { label, unit } = TARGETS[nextKind];
    const message = rangeError(label, value, TARGET_BOUNDS, { unit });
    if (message) return setProblem(message);
    try {
      const l = filterInductanceForTarget(
        nextKind === 'resonance'
          ? { kind: 'resonance', frequency: value, c: draft.filterC }
          : {
              kind: 'ripple',
              peakToPeak: value,
              vdc: draft.vdc,
              carrierFrequency: draft.carrierFrequency,
            },
      );
      setProblem(undefined);
      onChange({ filterL: l });
    } catch {
      // The target is fine; the DC bus, carrier or C it needs is refused on its own field.
      setProblem(
        `${label} needs a valid ${nextKind === 'resonance' ? 'Filter C' : 'DC bus and carrier'}`,
      );
    }
  };
  return (
    <>
      <SelectField<SizingKind>
        label="Filter L from"
        value={kind}
        onValueChange={(next) => {
          setKind(next);
          size(next, target);
        }}
        options={[
          { value: 'typed', label: 'the value typed above' },
          { value: 'resonance', label: 'a resonance (cut-off) target' },
          ...(carrier ? [{ value: 'ripple' as const, label: 'a ripple target' }] : []),
        ]}
      />
      {kind !== 'typed' ? (
        <NumberField
          label={TARGETS[kind].label}
          unit={TARGETS[kind].unit}
          value={target}
          onChange={(value) => size(kind, value)}
          error={problem}
          hint={`${TARGETS[kind].hint}; Filter L above follows it`}
        />
      ) : null}
    </>
  );
}
