import { useState } from 'react';
import {
  AngleTablePanel,
  type AngleTablePatternInput,
} from '../../../components/patterns/AngleTablePanel';
import { NumberField, SelectField, TextField, parseNumberList } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { PATTERN_KIND_OPTIONS } from '../../../lib/modulationOptions';
import { StudyCompareEventsPanel } from './StudyCompareEventsPanel';

type Goal = 'she' | 'optimal';

/**
 * Controller tables for a programmed pattern: the pattern's fields (eliminate chosen orders, or
 * minimise the WTHD with N angles), then the shared angle-table panel, which asks the service for
 * the table and its interpolation errors, and the compare events of a saved pattern study.
 */
export function PatternTablePanel() {
  const [goal, setGoal] = useState<Goal>('she');
  const [kind, setKind] = useState<'bipolar' | 'staircase'>('bipolar');
  const [vdc, setVdc] = useState(300);
  const [eliminate, setEliminate] = useState('5, 7, 11, 13');
  const [count, setCount] = useState(4);
  const pattern: AngleTablePatternInput =
    goal === 'she'
      ? {
          method: 'selective-harmonic-elimination',
          kind,
          vdc,
          eliminate: parseNumberList(eliminate),
        }
      : { method: 'optimal-pattern', kind, vdc, count };
  return (
    <div className="flex flex-col gap-4">
      <Panel title="Programmed pattern">
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
          <SelectField<Goal>
            label="Goal"
            value={goal}
            onValueChange={setGoal}
            options={[
              { value: 'she', label: 'Eliminate chosen orders' },
              { value: 'optimal', label: 'Minimise WTHD with N angles' },
            ]}
          />
          <SelectField<'bipolar' | 'staircase'>
            label="Pattern"
            value={kind}
            onValueChange={setKind}
            options={PATTERN_KIND_OPTIONS}
          />
          <NumberField label="DC level" unit="V" value={vdc} onChange={setVdc} />
          {goal === 'she' ? (
            <TextField
              label="Orders to eliminate"
              value={eliminate}
              onChange={(e) => setEliminate(e.target.value)}
              hint="odd orders ≥ 3, comma-separated"
            />
          ) : (
            <NumberField label="Angles per quarter" value={count} onChange={setCount} />
          )}
        </div>
      </Panel>
      <AngleTablePanel pattern={pattern} />
      <StudyCompareEventsPanel />
    </div>
  );
}
