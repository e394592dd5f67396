import { Button } from '../../../components/ui/Button';
import { NumberField, SelectField, TextField } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { fieldErrorOf, type Job } from '../../../lib/api';
import { PATTERN_KIND_OPTIONS } from '../../../lib/modulationOptions';
import {
  angleCountOf,
  cellVoltagesError,
  cellVoltagesOf,
  type EliminationForm as Form,
  type PatternKind,
  type PatternType,
} from '../model/eliminationForm';

export interface EliminationFormProps {
  form: Form;
  onChange: (form: Form) => void;
  onSubmit: () => void;
  running: boolean;
  /** The start request's error (a 400 names the field). */
  error: unknown;
  job: Job | undefined;
}

/** The pattern, the ma range and the job's progress bar. */
export function EliminationForm({
  form,
  onChange,
  onSubmit,
  running,
  error,
  job,
}: EliminationFormProps) {
  const set =
    <K extends keyof Form>(key: K) =>
    (value: Form[K]) =>
      onChange({ ...form, [key]: value });
  const fieldError = (...fields: string[]) =>
    fields.map((f) => fieldErrorOf(error, f)).find((m) => m !== undefined);
  const count = angleCountOf(form);
  // The library's words for sources it would refuse, else the service's (which names
  // cellVoltages, cellVoltages.length or one entry).
  const cellVoltagesMessage =
    cellVoltagesError(cellVoltagesOf(form), count) ??
    fieldError(
      'cellVoltages',
      'cellVoltages.length',
      ...Array.from({ length: count }, (_, k) => [
        `cellVoltages[${k}]`,
        `cellVoltages.${k}`,
      ]).flat(),
    );
  return (
    <Panel title="Pattern">
      <form
        onSubmit={(event) => {
          event.preventDefault();
          onSubmit();
        }}
        className="flex flex-col gap-3"
        noValidate
      >
        <SelectField<PatternType>
          label="Goal"
          value={form.type}
          onValueChange={set('type')}
          options={[
            { value: 'she', label: 'Eliminate chosen orders' },
            { value: 'optimal', label: 'Minimise distortion with N angles' },
          ]}
        />
        <SelectField<PatternKind>
          label="Pattern"
          value={form.kind}
          onValueChange={set('kind')}
          options={PATTERN_KIND_OPTIONS}
        />
        <NumberField
          label="DC level"
          unit="V"
          value={form.vdc}
          onChange={set('vdc')}
          error={fieldError('vdc')}
        />
        {form.type === 'she' ? (
          <>
            <TextField
              label="Orders to eliminate"
              value={form.eliminate}
              onChange={(e) => set('eliminate')(e.target.value)}
              hint={`odd orders ≥ 3; ${count} angles per quarter`}
              error={fieldError('eliminate', 'count')}
            />
            {form.kind === 'staircase' ? (
              <TextField
                label="Cell sources"
                unit="V"
                value={form.cellVoltages}
                onChange={(e) => set('cellVoltages')(e.target.value)}
                hint={`cascaded cells on unequal DC sources: ${count} values, cell k switching at angle k; blank for every cell at the DC level`}
                error={cellVoltagesMessage}
              />
            ) : null}
          </>
        ) : (
          <>
            <NumberField
              label="Angles per quarter"
              value={form.count}
              onChange={set('count')}
              hint="1 to 31"
              error={fieldError('count')}
            />
            <div className="grid grid-cols-2 gap-3">
              <SelectField<'wthd' | 'thd'>
                label="Minimise"
                value={form.objective}
                onValueChange={set('objective')}
                options={[
                  { value: 'wthd', label: 'WTHD' },
                  { value: 'thd', label: 'THD' },
                ]}
              />
              <NumberField
                label="Up to order"
                value={form.maxOrder}
                onChange={set('maxOrder')}
                error={fieldError('maxOrder')}
              />
            </div>
          </>
        )}
        <div className="grid grid-cols-2 gap-3">
          <NumberField
            label="ma from"
            value={form.from}
            onChange={set('from')}
            hint="V1/(L·vdc)"
            error={fieldError('fundamental.from')}
          />
          <NumberField
            label="ma to"
            value={form.to}
            onChange={set('to')}
            hint="below 4/π"
            error={fieldError('fundamental.to')}
          />
        </div>
        <NumberField
          label="Points"
          value={form.points}
          onChange={set('points')}
          hint="2 to 400"
          error={fieldError('fundamental.points', 'points')}
        />
        <Button type="submit" busy={running}>
          {form.type === 'she' ? 'Find the branches' : 'Find the optima'}
        </Button>
      </form>
      {job ? (
        <div className="mt-3">
          <div className="mb-1 flex justify-between text-xs">
            <span>Job {job.status}</span>
            <span className="num">{Math.round(job.progress * 100)} %</span>
          </div>
          <div
            role="progressbar"
            aria-label="Solving"
            aria-valuenow={Math.round(job.progress * 100)}
            aria-valuemin={0}
            aria-valuemax={100}
            className="h-3 overflow-hidden rounded-full bg-rule"
          >
            <div className="h-full bg-signal" style={{ width: `${job.progress * 100}%` }} />
          </div>
        </div>
      ) : null}
    </Panel>
  );
}
