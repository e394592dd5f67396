import type { InverterDesign } from '@pulsewright/modulation';
import type { StudyReport } from '../../../lib/api';
import { designRows } from '../model/describeDesign';

/**
 * The printed report's design table: every input with its units (`designRows`); a grid-tied
 * design's grid, LCL and, once the report is in, each standard's verdict on the grid current with
 * its caution, in the library's words.
 */
export function DesignTable({
  design,
  grid,
}: {
  design: InverterDesign;
  grid: StudyReport['grid'] | undefined;
}) {
  return (
    <table className="text-sm" aria-label="Design">
      <tbody>
        {designRows(design, grid ?? null).map(([label, value], i) => (
          <tr key={`${i}-${label}`} className="border-t border-rule/60">
            <th scope="row" className="py-0.5 pr-6 text-left align-top font-normal text-ink-soft">
              {label}
            </th>
            <td className="num py-0.5">{value}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
