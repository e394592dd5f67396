import { useMemo, useState } from 'react';
import { SelectField, SliderField } from '../../../components/ui/Field';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { ErrorState } from '../../../components/ui/QueryState';
import { formatNumber } from '../../../lib/format';
import { CLAMPING_OPTIONS, SEQUENCE_OPTIONS } from '../../../lib/modulationOptions';
import { MAX_M, sequenceFor, type SpaceVectorInput } from '../model/spaceVectorModel';
import { HexagonChart } from './HexagonChart';
import { SequenceChart } from './SequenceChart';

/** One reference vector: its sector, dwell times and the switching sequence of one period. */
export function SpaceVectorPage() {
  const [input, setInput] = useState<SpaceVectorInput>({
    m: 0.8,
    thetaDegrees: 25,
    sequence: 'seven-segment',
    clamping: 'dpwm1',
  });
  const { result, error } = useMemo(() => sequenceFor(input), [input]);
  return (
    <div>
      <PageHeader
        title="Space vector"
        subtitle="Move the reference vector; the dwell times and the symmetric switching sequence follow (fractions of the switching period Ts)."
      />
      <div className="grid gap-5 lg:grid-cols-[320px_minmax(0,1fr)]">
        <Panel title="Reference">
          <div className="flex flex-col gap-3">
            <SliderField
              label="Modulation index m"
              value={input.m}
              min={0}
              max={Number(MAX_M.toFixed(3))}
              step={0.005}
              hint="m = √3·|Vref|/Vdc; 1 is the inscribed circle"
              onChange={(m) => setInput({ ...input, m })}
            />
            <SliderField
              label="Angle θ"
              unit="degrees"
              value={input.thetaDegrees}
              min={0}
              max={359}
              step={1}
              onChange={(thetaDegrees) => setInput({ ...input, thetaDegrees })}
            />
            <SelectField
              label="Sequence"
              value={input.sequence}
              onValueChange={(sequence) => setInput({ ...input, sequence })}
              options={SEQUENCE_OPTIONS}
            />
            {input.sequence === 'five-segment' ? (
              <SelectField
                label="Clamping"
                value={input.clamping}
                onValueChange={(clamping) => setInput({ ...input, clamping })}
                options={CLAMPING_OPTIONS}
              />
            ) : null}
          </div>
          {result ? (
            <dl className="num mt-4 grid grid-cols-2 gap-2 text-sm">
              <dt>Sector</dt>
              <dd data-testid="sector">{result.sector}</dd>
              <dt>t1</dt>
              <dd>{formatNumber(result.t1)} Ts</dd>
              <dt>t2</dt>
              <dd>{formatNumber(result.t2)} Ts</dd>
              <dt>t0</dt>
              <dd>{formatNumber(result.t0)} Ts</dd>
              <dt>duty a/b/c</dt>
              <dd>
                {formatNumber(result.duties.a, 3)} / {formatNumber(result.duties.b, 3)} /{' '}
                {formatNumber(result.duties.c, 3)}
              </dd>
            </dl>
          ) : null}
        </Panel>
        <div className="flex min-w-0 flex-col gap-4">
          {error ? <ErrorState error={new Error(error)} /> : null}
          {result ? (
            <>
              <HexagonChart
                m={input.m}
                theta={(input.thetaDegrees * Math.PI) / 180}
                sector={result.sector}
              />
              <SequenceChart sequence={result} />
            </>
          ) : null}
        </div>
      </div>
    </div>
  );
}
