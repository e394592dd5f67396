import { LOSS_DEVICE_BOUNDS } from '@pulsewright/modulation';
import { NumberField, SelectField } from '../../../components/ui/Field';
import { rangeError, rangeText, type FieldUnit } from '../../../lib/fieldRange';
import type { SemiconductorDeviceKind } from '../model/studyDraft';
import type { StudyFieldsetArgs } from './studyFieldsetArgs';

type DeviceField = keyof typeof LOSS_DEVICE_BOUNDS;

/** Each datasheet value the form shows: label and unit (the library holds volts, ohms, joules, amperes). */
const VALUES: Record<DeviceField, { label: string; unit: FieldUnit }> = {
  vce0: { label: 'Transistor threshold', unit: { unit: 'V' } },
  rce: { label: 'Transistor slope resistance', unit: { scale: 1e3, unit: 'mΩ' } },
  vf0: { label: 'Diode threshold', unit: { unit: 'V' } },
  rf: { label: 'Diode slope resistance', unit: { scale: 1e3, unit: 'mΩ' } },
  rdsOn: { label: 'On-resistance', unit: { scale: 1e3, unit: 'mΩ' } },
  eon: { label: 'Turn-on energy', unit: { scale: 1e3, unit: 'mJ' } },
  eoff: { label: 'Turn-off energy', unit: { scale: 1e3, unit: 'mJ' } },
  err: { label: 'Diode recovery energy', unit: { scale: 1e3, unit: 'mJ' } },
  referenceVoltage: { label: 'Energies measured at', unit: { unit: 'V' } },
  referenceCurrent: { label: 'and at', unit: { unit: 'A' } },
};

const FIELDS: Record<SemiconductorDeviceKind, readonly DeviceField[]> = {
  igbt: ['vce0', 'rce', 'vf0', 'rf', 'eon', 'eoff', 'err', 'referenceVoltage', 'referenceCurrent'],
  mosfet: ['rdsOn', 'eon', 'eoff', 'err', 'referenceVoltage', 'referenceCurrent'],
};

const KINDS = [
  { value: 'none', label: 'None (no losses)' },
  { value: 'igbt', label: 'IGBT with diode' },
  { value: 'mosfet', label: 'MOSFET, synchronous rectification' },
] as const;

/**
 * The study form's switching device fieldset: none, an IGBT with its diode or a MOSFET, with
 * the datasheet values the report's losses use (bounds LOSS_DEVICE_BOUNDS, shown in V, mΩ, mJ
 * and A). A render function, not a component: the form calls it while rendering so the
 * messages it asks for are claimed before the form lists the unclaimed ones.
 */
export function deviceFields({ draft, onChange, readOnly, fields: { error } }: StudyFieldsetArgs) {
  const kind = draft.deviceKind;
  const setValue = (field: DeviceField) => (value: number) =>
    kind === 'igbt'
      ? onChange({ igbt: { ...draft.igbt, [field]: value } })
      : onChange({ mosfet: { ...draft.mosfet, [field]: value } });
  return (
    <fieldset disabled={readOnly} className="flex flex-col gap-3">
      <legend className="mb-1 text-sm font-semibold tracking-wide uppercase">
        Switching device
      </legend>
      <SelectField
        label="Device for the losses"
        value={kind}
        options={KINDS}
        onValueChange={(deviceKind) => onChange({ deviceKind })}
        error={error('device.kind')}
      />
      {kind === 'none' ? null : (
        <div className="grid grid-cols-2 gap-3">
          {FIELDS[kind].map((field) => {
            const { label, unit } = VALUES[field];
            const device: Partial<Record<DeviceField, number>> = draft[kind];
            const value = device[field] ?? Number.NaN;
            const bounds = LOSS_DEVICE_BOUNDS[field];
            return (
              <NumberField
                key={field}
                label={label}
                unit={unit.unit}
                value={value}
                scale={unit.scale}
                hint={rangeText(bounds, unit)}
                error={rangeError(label, value, bounds, unit) ?? error(`device.${field}`)}
                onChange={setValue(field)}
              />
            );
          })}
        </div>
      )}
    </fieldset>
  );
}
