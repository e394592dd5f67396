import { labelHarmonics } from '@pulsewright/modulation';
import { useQueries } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { SpectrumChart, type SpectrumSeries } from '../../../components/charts/SpectrumChart';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { Empty, ErrorState, Loading, QueryView } from '../../../components/ui/QueryState';
import { formatNumber, formatPercent } from '../../../lib/format';
import { studyQueryOptions, studySpectrumQueryOptions, useStudies } from '../api/studies';

const COLOURS = ['#12263a', '#d9822b', '#2a8c82', '#8e3b6e', '#c2462e', '#5b6fa8'];

/** Two or more studies side by side: summary figures and overlaid spectra (computed by the API). */
export function ComparePage() {
  const [params, setParams] = useSearchParams();
  const fromUrl = params.get('ids') ?? '';
  // The ticked studies live in component state so a checkbox changes the moment it is clicked;
  // the URL follows (shareable link) and a link to /compare?ids=… sets the state.
  const [ids, setIds] = useState(() => parseIds(fromUrl));
  const [seenUrl, setSeenUrl] = useState(fromUrl);
  if (fromUrl !== seenUrl) {
    // The URL changed from outside (a link, back/forward): adopt it while rendering.
    setSeenUrl(fromUrl);
    if (fromUrl !== ids.join(',')) setIds(parseIds(fromUrl));
  }
  useEffect(() => {
    const joined = ids.join(',');
    if (joined !== fromUrl) setParams(joined ? { ids: joined } : {}, { replace: true });
  }, [ids, fromUrl, setParams]);
  const all = useStudies();
  const studies = useQueries({ queries: ids.map((id) => studyQueryOptions(id)) });
  const spectra = useQueries({ queries: ids.map((id) => studySpectrumQueryOptions(id, 150)) });
  const toggle = (id: string) => setIds((current) => (current.includes(id) ? current.filter((x) => x !== id) : [...current, id]));

  const pending = [...studies, ...spectra].some((q) => q.isPending);
  const failed = [...studies, ...spectra].find((q) => q.isError);
  const series: SpectrumSeries[] = [];
  ids.forEach((_, i) => {
    const study = studies[i]?.data;
    const spectrum = spectra[i]?.data;
    if (!study || !spectrum) return;
    const stored = study.modulation as { mf?: unknown; frequencyRatio?: unknown };
    const mf = Number(stored.mf ?? stored.frequencyRatio) || 1;
    series.push({ name: study.name, color: COLOURS[i % COLOURS.length] ?? '#12263a', harmonics: labelHarmonics(spectrum.harmonics, mf) });
  });

  return (
    <div>
      <PageHeader title="Compare studies" subtitle="Pick two or more studies; their predicted spectra are overlaid (computed by the service at each study's current revision)." />
      <div className="grid gap-5 lg:grid-cols-[280px_minmax(0,1fr)]">
        <Panel title="Studies">
          <QueryView query={all} empty="No studies to compare yet.">
            {(list) => (
              <ul className="flex flex-col gap-1 text-sm">
                {list.map((s) => (
                  <li key={s.id}>
                    <label className="flex items-center gap-2">
                      <input type="checkbox" className="accent-signal" checked={ids.includes(s.id)} onChange={() => toggle(s.id)} />
                      {s.name}
                    </label>
                  </li>
                ))}
              </ul>
            )}
          </QueryView>
        </Panel>
        <div className="flex min-w-0 flex-col gap-4">
          {ids.length < 2 ? <Empty>Select at least two studies to overlay their spectra.</Empty> : null}
          {ids.length > 0 && pending ? <Loading label="Computing the spectra…" /> : null}
          {failed ? <ErrorState error={failed.error} onRetry={() => failed.refetch()} /> : null}
          {series.length ? (
            <>
              <Panel title="Summary">
                <table className="w-full text-sm [&_td]:px-2 [&_th]:px-2">
                  <thead className="text-left text-xs text-ink-soft uppercase">
                    <tr>
                      <th scope="col">Study</th>
                      <th scope="col">Method</th>
                      <th scope="col">Fundamental (V)</th>
                      <th scope="col">THD</th>
                      <th scope="col">WTHD</th>
                    </tr>
                  </thead>
                  <tbody className="num">
                    {ids.map((id, i) => {
                      const study = studies[i]?.data;
                      const spectrum = spectra[i]?.data;
                      if (!study || !spectrum) return null;
                      return (
                        <tr key={id} className="border-t border-rule/60">
                          <td className="font-sans">
                            <span className="mr-1 inline-block h-2.5 w-2.5 rounded-sm" style={{ background: COLOURS[i % COLOURS.length] }} />
                            {study.name}
                          </td>
                          <td className="font-sans">{study.method}</td>
                          <td>{formatNumber(spectrum.harmonics.find((h) => h.order === 1)?.amplitude ?? 0)}</td>
                          <td>{formatPercent(spectrum.thd)}</td>
                          <td>{formatPercent(spectrum.wthd, 3)}</td>
                        </tr>
                      );
                    })}
                  </tbody>
                </table>
              </Panel>
              <SpectrumChart series={series} title="Spectra overlaid" fileName="compare-spectra" />
            </>
          ) : null}
        </div>
      </div>
    </div>
  );
}

function parseIds(value: string): string[] {
  return value.split(',').filter(Boolean);
}
