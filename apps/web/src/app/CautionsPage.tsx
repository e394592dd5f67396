import { Link } from 'react-router-dom';
import { paths } from '../config/paths';
import { CAUTION_TEXT } from '../components/ui/Caution';
import { PageHeader, Panel } from '../components/ui/Panel';

export function CautionsPage() {
  return (
    <div className="max-w-3xl">
      <PageHeader
        title="Cautions"
        subtitle="Read before building or testing hardware from anything Pulsewright predicts."
      />
      <Panel>
        <p className="mb-3 text-base font-medium">{CAUTION_TEXT}</p>
        <ul className="list-disc space-y-1 pl-5 text-sm">
          <li>
            Discharge and verify the DC bus before touching any part of the inverter; capacitors
            hold charge after the supply is removed.
          </li>
          <li>
            Harmonic limits shown here (IEEE Std 519-2022, recalled from memory) must be confirmed
            with the standard itself and the local utility.
          </li>
          <li>
            Timer tables are a starting point for firmware: check dead time, minimum pulse and fault
            handling on the real gate drive before switching at full voltage.
          </li>
        </ul>
        <p className="mt-3 text-xs text-ink-soft">
          The same text is kept in docs/cautions.md in the repository.
        </p>
        <Link to={paths.studies.getHref()} className="mt-3 inline-block text-sm underline">
          Back to the studies
        </Link>
      </Panel>
    </div>
  );
}
