/**
 * Benchmark (not a test): a 64-row angle table for a controller from a 5-angle bipolar SHE branch
 * (eliminating orders 5, 7, 11, 13; Patel and Hoft, IEEE Trans. Ind. Appl., 1973) over ma 0.1 to
 * 1.1, with the exact midpoint error of linear interpolation on each of its 63 intervals
 * (`angleTable` + `angleTableMidpointErrors`), against the 64-point `sheSweep` alone over the same
 * range following one branch (`maxBranches: 1`, the branch the table follows, as the API's SHE
 * sweep job does), both timed in the same run (median after warm-up). Goal from issue 17: the
 * table with its midpoint errors in under 50 ms. No timing is asserted. The table's worst eliminated residual
 * and worst midpoint error are printed as a check that the work was done.
 *
 * Run directly: `npx tsx bench/angle-table.ts` (after building packages/modulation); `npm run
 * bench` runs it with the others (bench/run-all.ts runs every file here).
 */
import { pathToFileURL } from 'node:url';
import {
  angleTable,
  angleTableMidpointErrors,
  sheSweep,
  type AngleTable,
  type AngleTableMidpointErrors,
} from '@pulsewright/modulation';
import { medianTime } from './measure.js';

const vdc = 400;
const eliminate = [5, 7, 11, 13];
const rows = 64;
const ma = { from: 0.1, to: 1.1 };

/** Times both and returns printable lines. */
export function runAngleTableBench(): string[] {
  const sweepMs = medianTime(
    () =>
      sheSweep({
        kind: 'bipolar',
        vdc,
        count: 5,
        eliminate,
        fundamentals: { from: ma.from * vdc, to: ma.to * vdc, points: rows },
        maxBranches: 1,
      }),
    15,
    3,
  );
  const last: { table?: AngleTable; errors?: AngleTableMidpointErrors } = {};
  const tableMs = medianTime(
    () => {
      last.table = angleTable({
        pattern: { method: 'selective-harmonic-elimination', kind: 'bipolar', vdc, eliminate },
        ma,
        rows,
      });
      last.errors = angleTableMidpointErrors(last.table);
    },
    15,
    3,
  );
  const worstRow = Math.max(...(last.table?.rows ?? []).map((r) => r.worstResidual ?? Infinity));
  const solved = (last.table?.rows ?? []).filter((r) => r.solved).length;
  return [
    `Angle table: bipolar SHE, 5 angles, eliminating ${eliminate.join(', ')}, ${rows} rows over ma ${ma.from}–${ma.to}`,
    `  sheSweep alone (${rows} points, one branch)   ${sweepMs.toFixed(1)} ms`,
    `  angleTable + angleTableMidpointErrors        ${tableMs.toFixed(1)} ms (goal < 50 ms${tableMs < 50 ? ', met' : ', NOT met'})`,
    `  ratio table with midpoint errors / sweep: ${(tableMs / sweepMs).toFixed(2)}×`,
    `  rows solved ${solved} of ${rows}; worst row residual ${worstRow.toExponential(2)} of the fundamental;` +
      ` worst midpoint residual ${(last.errors?.worstResidual ?? NaN).toExponential(2)}`,
  ];
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) {
  console.log(runAngleTableBench().join('\n'));
}
