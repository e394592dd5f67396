import { formatNumber } from '../../../lib/format';
import { labelOf, PATTERN_KIND_OPTIONS } from '../../../lib/modulationOptions';
import type { StoredPattern } from '../model/studyDraft';
import { RADIANS_TO_DEGREES } from './studyFormUnits';

/** The stored pattern of a pattern study, read-only: its angles come from the elimination page. */
export function PatternSummary({
  pattern,
  vdc,
  error,
}: {
  pattern: StoredPattern | null;
  vdc: number;
  error?: string | undefined;
}) {
  if (!pattern)
    return (
      <p role="alert" className="text-sm text-bad">
        {error ??
          'This study has no pattern: pick a point on the harmonic-elimination page and save it as a study.'}
      </p>
    );
  return (
    <div
      className="rounded border border-rule bg-panel px-3 py-2 text-sm"
      data-testid="she-pattern"
    >
      <p>
        {labelOf(PATTERN_KIND_OPTIONS, pattern.kind)} ·{' '}
        {pattern.cellVoltages ? (
          'cells on their own DC sources (below)'
        ) : (
          <>
            DC level <span className="num">{formatNumber(vdc)} V</span>
          </>
        )}
        {pattern.eliminate?.length ? (
          <>
            {' '}
            · eliminates orders <span className="num">{pattern.eliminate.join(', ')}</span>
          </>
        ) : null}
        {pattern.fundamental !== undefined ? (
          <>
            {' '}
            · solved for <span className="num">{formatNumber(pattern.fundamental)} V</span>
          </>
        ) : null}
      </p>
      <table className="mt-2 w-full text-left text-xs" aria-label="First-quarter switching angles">
        <thead>
          <tr>
            <th className="font-semibold">Angle</th>
            <th className="font-semibold">degrees</th>
            <th className="font-semibold">radians</th>
            {pattern.cellVoltages ? <th className="font-semibold">cell source (V)</th> : null}
          </tr>
        </thead>
        <tbody className="num">
          {pattern.angles.map((angle, k) => (
            <tr key={k}>
              <td>α{k + 1}</td>
              <td>{formatNumber(angle * RADIANS_TO_DEGREES, 6)}°</td>
              <td>{angle.toFixed(9)}</td>
              {pattern.cellVoltages ? (
                <td>{formatNumber(pattern.cellVoltages[k] ?? Number.NaN)}</td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-xs text-ink-soft">
        The angles were solved on the harmonic-elimination page; pick another point there to change
        them. Name, note, fundamental frequency, load and filter can be edited here.
      </p>
      {error ? (
        <p role="alert" className="mt-1 text-xs text-bad">
          {error}
        </p>
      ) : null}
    </div>
  );
}
