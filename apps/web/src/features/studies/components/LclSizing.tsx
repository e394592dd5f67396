import { useState } from 'react';
import { Button } from '../../../components/ui/Button';
import { NumberField } from '../../../components/ui/Field';
import { errorMessage, fieldErrorOf, sizeLclFilter } from '../../../lib/api';
import { formatNumber } from '../../../lib/format';
import type { StudyDraft } from '../model/studyDraft';

type Sized = Awaited<ReturnType<typeof sizeLclFilter>>;

/**
 * Sizes the LCL filter of a three-phase grid-connected design with the library's
 * `designLclFilter` (M. Liserre, F. Blaabjerg, S. Hansen, IEEE Trans. Industry Applications,
 * 2005), asked of the service (POST /filters/lcl-design) for the rated power typed here and the
 * draft's grid voltage, fundamental, carrier and DC bus, and puts L1, C, the series damping
 * resistor and L2 in the draft's filter and grid fields. Shows the resonance and the library's
 * notes; a refusal lands on the rated power or is shown as the service words it.
 */
export function LclSizing({
  draft,
  onChange,
  readOnly,
}: {
  draft: StudyDraft;
  onChange: (patch: Partial<StudyDraft>) => void;
  readOnly: boolean;
}) {
  const [power, setPower] = useState(10_000);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<unknown>(null);
  const [sized, setSized] = useState<Sized | null>(null);
  const size = async () => {
    setBusy(true);
    setError(null);
    try {
      const filter = await sizeLclFilter({
        power,
        lineVoltage: draft.gridLineVoltage,
        gridFrequency: draft.fundamentalFrequency,
        switchingFrequency: draft.carrierFrequency,
        vdc: draft.vdc,
      });
      setSized(filter);
      onChange({
        filterOn: true,
        filterL: filter.l1,
        filterC: filter.c,
        filterR: filter.rDamping,
        dampingPlacement: 'series-with-capacitor',
        gridL2: filter.l2,
      });
    } catch (caught) {
      setSized(null);
      setError(caught);
    } finally {
      setBusy(false);
    }
  };
  const powerError = fieldErrorOf(error, 'power');
  return (
    <div className="col-span-2 flex flex-col gap-2 rounded-md border border-rule px-3 py-2">
      <NumberField
        label="Rated power (for sizing)"
        unit="kW"
        value={power}
        scale={1e-3}
        hint="all phases; sizing reads it with the grid voltage, fundamental, carrier and DC bus"
        error={powerError}
        onChange={setPower}
      />
      <div>
        <Button variant="secondary" busy={busy} disabled={readOnly} onClick={() => void size()}>
          Size the LCL filter (Liserre et al. 2005)
        </Button>
      </div>
      {error !== null && powerError === undefined ? (
        <p role="alert" className="text-xs font-medium text-bad">
          {errorMessage(error)}
        </p>
      ) : null}
      {sized ? (
        <div className="text-xs" data-testid="lcl-sizing">
          <p>
            L1 {formatNumber(sized.l1 * 1e3)} mH, C {formatNumber(sized.c * 1e6)} µF, R_d{' '}
            {formatNumber(sized.rDamping)} Ω in series with C, L2 {formatNumber(sized.l2 * 1e3)} mH
            put in the filter and grid fields; resonance {formatNumber(sized.resonanceFrequency)} Hz
            ({sized.withinResonanceRange ? 'within' : 'outside'}{' '}
            {formatNumber(sized.resonanceRange.min)} to {formatNumber(sized.resonanceRange.max)} Hz;
            the paper&apos;s targets as the library recalls them, from memory: confirm with it).
          </p>
          {sized.notes.map((note) => (
            <p key={note}>{note}</p>
          ))}
        </div>
      ) : null}
    </div>
  );
}
