import { useMemo, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { LineChart, type LineSeries } from '../../../components/charts/LineChart';
import { SpectrumChart } from '../../../components/charts/SpectrumChart';
import { Button } from '../../../components/ui/Button';
import { SelectField, TextField } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { paths } from '../../../config/paths';
import {
  errorMessage,
  fieldErrorOf,
  roleAtLeast,
  useCreateStudy,
  useMe,
  useProjects,
} from '../../../lib/api';
import { formatNumber, formatPercent } from '../../../lib/format';
import { patternFigures, type SolvedPattern } from '../model/eliminationForm';
import { CompareEventsPanel } from '../../../components/patterns/CompareEventsPanel';
import type { SweepPoint } from './useEliminationSweep';

/** The fundamental frequency a saved pattern study starts with, hertz (edited in the study). */
const SAVED_FUNDAMENTAL_FREQUENCY = 50;

/** One colour per angle, so each angle's curve keeps its colour across charts and the legend. */
export const ANGLE_COLOURS = [
  '#12263a',
  '#d9822b',
  '#2a8c82',
  '#8e3b6e',
  '#c2462e',
  '#5b6fa8',
  '#7a6a2f',
  '#3d8a5a',
];

export interface EliminationResultProps {
  pattern: SolvedPattern;
  points: SweepPoint[];
  solvedFraction: number;
  picked: number | null;
  onPick: (point: number | null) => void;
}

/** The branch (or family of optima) against ma, its objective, and the picked point. */
export function EliminationResult({
  pattern,
  points,
  solvedFraction,
  picked,
  onPick,
}: EliminationResultProps) {
  const angleSeries: LineSeries[] = Array.from({ length: pattern.count }, (_, k) => ({
    name: `α${k + 1}`,
    color: ANGLE_COLOURS[k % ANGLE_COLOURS.length] ?? '#12263a',
    x: points.map((p) => p.ma),
    y: points.map((p) => ((p.angles[k] ?? Number.NaN) * 180) / Math.PI),
  }));
  // The optimum's own objective, or for an elimination pattern its whole-waveform WTHD from the
  // library's design report (computed once per finished sweep).
  const objective = useMemo(
    () => points.map((p) => p.objective ?? patternFigures(pattern, p.angles).wthd),
    [points, pattern],
  );
  const objectiveName =
    pattern.type === 'optimal'
      ? `${pattern.objective.toUpperCase()} to order ${pattern.maxOrder} (minimised)`
      : 'WTHD, whole waveform';
  const jumps = points.filter((p, i) => i > 0 && !p.continued).length;
  return (
    <>
      <Panel>
        <p className="text-sm" data-testid="she-summary">
          {`${pattern.type === 'she' ? 'One branch followed' : 'One family of optima followed'}; solved at ${formatPercent(solvedFraction, 0)} of the points asked.`}
          {jumps > 0
            ? ` The optimum was searched afresh at ${jumps} point(s): the angles may jump there.`
            : ''}
        </p>
      </Panel>
      <LineChart
        title="Switching angles against ma"
        fileName={pattern.type === 'she' ? 'she-branch' : 'optimal-family'}
        xLabel="ma = V1/(L·vdc)"
        yLabel="angle (degrees)"
        series={angleSeries}
        onPick={(_, point) => onPick(point)}
        picked={picked === null ? null : { series: 0, point: picked }}
      />
      <LineChart
        title="Objective against ma"
        fileName={pattern.type === 'she' ? 'she-wthd' : 'optimal-objective'}
        xLabel="ma = V1/(L·vdc)"
        yLabel="ratio"
        series={[
          { name: objectiveName, color: '#c2462e', x: points.map((p) => p.ma), y: objective },
        ]}
        onPick={(_, point) => onPick(point)}
        picked={picked === null ? null : { series: 0, point: picked }}
        yFormat={(v) => formatPercent(v, 1)}
      />
      {picked !== null && points[picked] ? (
        <PickedPoint pattern={pattern} point={points[picked]} />
      ) : (
        <p className="text-xs text-ink-soft">
          Pick a point on a curve to see its angles and spectrum and to save it as a study.
        </p>
      )}
    </>
  );
}

/** The picked point: a table of its angles, its spectrum, and saving it as a study. */
function PickedPoint({ pattern, point }: { pattern: SolvedPattern; point: SweepPoint }) {
  const me = useMe();
  const canSave = roleAtLeast(me.data?.role, 'engineer');
  const save = useCreateStudy();
  const projects = useProjects();
  const navigate = useNavigate();
  const [target, setTarget] = useState<{ projectId: string; name: string | null }>({
    projectId: '',
    name: null,
  });
  const figures = useMemo(() => patternFigures(pattern, point.angles), [pattern, point]);
  const projectId = target.projectId || projects.data?.[0]?.id || '';
  const what =
    pattern.type === 'she'
      ? `SHE ${pattern.kind} eliminating ${pattern.orders.join(', ')}`
      : `Optimal ${pattern.kind} ${pattern.count} angles, least ${pattern.objective.toUpperCase()}`;
  const studyName = target.name ?? `${what} at ma ${formatNumber(point.ma)}`.slice(0, 120);
  const saveStudy = () => {
    if (!projectId || !studyName.trim()) return;
    save.mutate(
      {
        projectId,
        name: studyName.trim(),
        note: `Picked on the harmonic-elimination page (${point.angles.length} first-quarter angles, ma ${formatNumber(point.ma)}).`,
        // A pattern has no carrier; the fundamental frequency (for a load or a filter) is set in the study.
        design: {
          vdc: pattern.vdc,
          fundamentalFrequency: SAVED_FUNDAMENTAL_FREQUENCY,
          modulation:
            pattern.type === 'she'
              ? {
                  method: 'selective-harmonic-elimination',
                  kind: pattern.kind,
                  angles: point.angles,
                  ...(pattern.cellVoltages === undefined
                    ? {}
                    : { cellVoltages: pattern.cellVoltages }),
                  eliminate: pattern.orders,
                  fundamental: point.fundamental,
                }
              : {
                  method: 'optimal-pattern',
                  kind: pattern.kind,
                  angles: point.angles,
                  fundamental: point.fundamental,
                },
          load: null,
          filter: null,
        },
      },
      { onSuccess: (study) => navigate(paths.study.getHref(study.id)) },
    );
  };
  return (
    <>
      <Panel title="Picked point">
        <p className="num text-sm">
          ma {formatNumber(point.ma)} · fundamental {formatNumber(point.fundamental)} V · THD{' '}
          {formatPercent(figures.thd)} · WTHD {formatPercent(figures.wthd)} (whole waveform)
        </p>
        <table className="num mt-2 text-sm" aria-label="Angles at the picked point">
          <thead>
            <tr className="text-left text-xs text-ink-soft">
              <th className="pr-4">angle</th>
              <th className="pr-4">degrees</th>
              <th className="pr-4">radians</th>
            </tr>
          </thead>
          <tbody>
            {point.angles.map((a, k) => (
              <tr key={k}>
                <td className="pr-4">
                  <span
                    className="mr-1 inline-block h-2.5 w-2.5 rounded-sm"
                    style={{ background: ANGLE_COLOURS[k % ANGLE_COLOURS.length] }}
                  />
                  {`α${k + 1}`}
                </td>
                <td className="pr-4">{formatNumber((a * 180) / Math.PI)}</td>
                <td className="pr-4">{formatNumber(a, 6)}</td>
              </tr>
            ))}
          </tbody>
        </table>
        {canSave ? (
          <div className="mt-3 grid gap-3 sm:grid-cols-[minmax(0,1fr)_minmax(0,1fr)_auto] sm:items-end">
            <SelectField
              label="Project"
              value={projectId}
              onChange={(e) => setTarget({ ...target, projectId: e.target.value })}
              error={fieldErrorOf(save.error, 'projectId')}
              options={
                projects.data?.length
                  ? projects.data.map((p) => ({ value: p.id, label: p.name }))
                  : [{ value: '', label: 'No projects yet' }]
              }
            />
            <TextField
              label="Study name"
              value={studyName}
              maxLength={120}
              onChange={(e) => setTarget({ ...target, name: e.target.value })}
              error={fieldErrorOf(save.error, 'name')}
            />
            <Button
              onClick={saveStudy}
              busy={save.isPending}
              disabled={!projectId || !studyName.trim()}
            >
              Save as study
            </Button>
          </div>
        ) : (
          <p className="mt-2 text-xs text-ink-soft">Saving needs the engineer role.</p>
        )}
        {save.isError ? (
          <p role="alert" className="mt-2 text-sm text-bad">
            {errorMessage(save.error)}
          </p>
        ) : null}
      </Panel>
      <SpectrumChart
        series={[
          { name: 'Picked pattern', color: 'var(--color-ink)', harmonics: figures.spectrum },
        ]}
        title="Spectrum of the picked pattern"
        fileName="pattern-point-spectrum"
        labelThreshold={2}
      />
      {pattern.cellVoltages === undefined ? (
        <CompareEventsPanel
          source={{ pattern: { kind: pattern.kind, vdc: pattern.vdc, angles: point.angles } }}
          orders={pattern.orders}
        />
      ) : (
        <p className="text-xs text-ink-soft">
          Compare events and angle tables take cells of equal sources only.
        </p>
      )}
    </>
  );
}
