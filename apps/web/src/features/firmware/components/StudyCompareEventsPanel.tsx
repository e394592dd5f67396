import { useState } from 'react';
import { CompareEventsPanel } from '../../../components/patterns/CompareEventsPanel';
import { SelectField } from '../../../components/ui/Field';
import { errorMessage, useStudies, type Study } from '../../../lib/api';

/** The study methods that store first-quarter angles (a programmed pattern). */
const PATTERN_METHODS: readonly string[] = ['selective-harmonic-elimination', 'optimal-pattern'];

/** The orders a saved SHE study was solved to eliminate (none for an optimal pattern). */
function eliminatedOrders(study: Study | undefined): number[] {
  const modulation = study?.design.modulation;
  return modulation?.method === 'selective-harmonic-elimination'
    ? (modulation.eliminate ?? [])
    : [];
}

/**
 * Compare events of a saved pattern on the controller-tables page: pick one of the team's SHE or
 * optimal-pattern studies, and the shared panel asks the service for its events by study id (the
 * service reads the study with the caller's role; the angles are never copied here).
 */
export function StudyCompareEventsPanel() {
  const studies = useStudies();
  const patterns = (studies.data ?? []).filter((s) => PATTERN_METHODS.includes(s.method));
  const [studyId, setStudyId] = useState('');
  const chosen = patterns.find((s) => s.id === studyId);
  const picker = (
    <div className="mb-3 max-w-md">
      <SelectField<string>
        label="Saved pattern study"
        value={chosen ? chosen.id : ''}
        onValueChange={setStudyId}
        options={[
          {
            value: '',
            label: patterns.length > 0 ? 'Choose a study' : 'No saved SHE or optimal-pattern study',
          },
          ...patterns.map((s) => ({ value: s.id, label: `${s.name} (${s.method})` })),
        ]}
        error={studies.isError ? errorMessage(studies.error) : undefined}
      />
    </div>
  );
  return (
    <CompareEventsPanel
      source={chosen ? { studyId: chosen.id } : null}
      orders={eliminatedOrders(chosen)}
      picker={picker}
    />
  );
}
