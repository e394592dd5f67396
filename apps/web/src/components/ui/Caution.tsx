import { Link } from 'react-router-dom';
import { paths } from '../../config/paths';

/** The hazard caution every page shows (docs/references.md, "Cautions"). */
export const CAUTION_TEXT =
  'Inverter DC buses and outputs are lethal. Predictions here are idealised (ideal switches unless a loss or dead-time model is chosen) and are no substitute for measurement, protective design, and the codes and licensed practice that apply where the equipment is built and installed.';

export function CautionBanner({ compact = false }: { compact?: boolean }) {
  return (
    <aside
      aria-label="Safety caution"
      className="flex items-start gap-2 border-l-4 border-signal bg-signal-soft px-3 py-2 text-xs text-ink"
    >
      <span aria-hidden className="mt-0.5 font-bold text-signal">
        ⚠
      </span>
      <p>
        <strong>High voltage.</strong>{' '}
        {compact
          ? 'Inverter DC buses and outputs are lethal; predictions are idealised.'
          : CAUTION_TEXT}{' '}
        <Link to={paths.cautions.getHref()} className="font-medium underline">
          Read the cautions
        </Link>
      </p>
    </aside>
  );
}
