import { DESIGN_BOUNDS } from '@pulsewright/modulation';
import { NumberField, SliderField } from '../../../components/ui/Field';
import { rangeText } from '../../../lib/fieldRange';
import { isCarrierMethod } from '../model/studyDraft';
import type { StudyFieldsetArgs } from './studyFieldsetArgs';
import { DEGREES, RADIANS_TO_DEGREES } from './studyFormUnits';
import { ratioBounds, type CarrierFields } from './useCarrierFields';

/** The mf slider covers the useful part of its range; the number box beside takes the whole range. */
const MF_SLIDER = { min: 1, max: 201 } as const;

/**
 * The fundamental frequency (Hz), and for carrier methods the frequency ratio mf, the carrier
 * frequency (Hz) and the carrier phase (held in radians, shown in degrees). A render function,
 * not a component: see `modulationFields`.
 */
export function frequencyFields({
  draft,
  onChange,
  fields: { limits },
  carrier: { ratio, ratioError, carrierMessage, spanHint, setRatio, setCarrier, setFundamental },
}: Omit<StudyFieldsetArgs, 'readOnly'> & {
  carrier: CarrierFields;
}) {
  const { method } = draft;
  return (
    <>
      <NumberField
        label="Fundamental frequency"
        unit="Hz"
        value={draft.fundamentalFrequency}
        {...limits('fundamentalFrequency', 'Fundamental frequency', draft.fundamentalFrequency, {
          unit: 'Hz',
        })}
        onChange={setFundamental}
      />
      {isCarrierMethod(method) ? (
        <>
          <SliderField
            label="Frequency ratio mf"
            value={
              Number.isFinite(ratio) ? ratio : draft.carrierFrequency / draft.fundamentalFrequency
            }
            min={MF_SLIDER.min}
            max={MF_SLIDER.max}
            step={1}
            hint={`carrier ÷ fundamental, ${rangeText(ratioBounds(draft))}${method === 'space-vector' ? ' (switching periods per fundamental period)' : '; odd values give quarter-wave symmetry'}`}
            error={ratioError}
            onChange={setRatio}
          />
          <NumberField
            label="Carrier frequency"
            unit="Hz"
            value={draft.carrierFrequency}
            hint={
              spanHint ??
              (Number.isFinite(ratio)
                ? `mf = ${ratio} · a whole multiple of the fundamental${ratioBounds(draft).integer ? '' : ', or any ratio (analysed over q periods of its nearest p/q)'}`
                : 'a whole multiple of the fundamental')
            }
            error={carrierMessage}
            onChange={setCarrier}
          />
          {method !== 'space-vector' ? (
            <NumberField
              label="Carrier phase"
              unit="°"
              value={draft.carrierPhase}
              scale={RADIANS_TO_DEGREES}
              {...limits('modulation.carrierPhase', 'Carrier phase', draft.carrierPhase, DEGREES)}
              hint={`${rangeText(DESIGN_BOUNDS['modulation.carrierPhase'], DEGREES)}; 0 puts a carrier valley at the reference's positive peak`}
              onChange={(carrierPhase) => onChange({ carrierPhase })}
            />
          ) : null}
        </>
      ) : null}
    </>
  );
}
