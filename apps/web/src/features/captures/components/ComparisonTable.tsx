import { Panel } from '../../../components/ui/Panel';
import { formatNumber } from '../../../lib/format';
import type { CaptureComparison } from '../../../lib/api';

/** Measured against predicted amplitude order by order (orders below a thousandth of the fundamental in both are left out). */
export function ComparisonTable({ comparison }: { comparison: CaptureComparison }) {
  const rows = comparison.orders.filter(
    (o) =>
      o.order === 1 ||
      o.predicted > 1e-3 * (comparison.orders[0]?.predicted ?? 1) ||
      o.measured > 1e-3 * (comparison.orders[0]?.measured ?? 1),
  );
  return (
    <Panel title="Order by order">
      <div className="max-h-72 overflow-auto">
        <table className="num w-full text-sm">
          <thead className="sticky top-0 bg-panel text-left text-xs text-ink-soft">
            <tr>
              <th scope="col">Order</th>
              <th scope="col">Hz</th>
              <th scope="col">Measured (V)</th>
              <th scope="col">Predicted (V)</th>
              <th scope="col">Measured / predicted</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((o) => (
              <tr key={o.order} className="border-t border-rule/60">
                <td>{o.order}</td>
                <td>{formatNumber(o.frequency)}</td>
                <td>{formatNumber(o.measured)}</td>
                <td>{formatNumber(o.predicted)}</td>
                <td>{o.ratio === null ? '—' : formatNumber(o.ratio)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </Panel>
  );
}
