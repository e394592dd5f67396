import { useQueries } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import {
  studyQueryOptions,
  studyReportQueryOptions,
  type Study,
  type StudyReport,
} from '../../../lib/api';

const COLOURS = ['#12263a', '#d9822b', '#2a8c82', '#8e3b6e', '#c2462e', '#5b6fa8'];

/** One compared study: its record, its design report and the colour that marks it in the table and the chart. */
export interface ComparedRow {
  id: string;
  study: Study;
  report: StudyReport;
  color: string;
}

/**
 * The studies ticked for comparison (kept in step with the `ids` search parameter), their
 * records and design reports from the service, and the rows ready to draw.
 */
export function useComparedStudies() {
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
  const studies = useQueries({ queries: ids.map((id) => studyQueryOptions(id)) });
  // Compare draws figures and spectra, no time series: the fewest chart samples keep each report
  // small (a filtered mf-400 report is about 1 MB at the default); no figure depends on them.
  const reports = useQueries({
    queries: ids.map((id) => studyReportQueryOptions(id, { points: 64 })),
  });
  const toggle = (id: string) =>
    setIds((current) =>
      current.includes(id) ? current.filter((x) => x !== id) : [...current, id],
    );

  const pending = [...studies, ...reports].some((q) => q.isPending);
  const failed = [...studies, ...reports].find((q) => q.isError);
  const rows: ComparedRow[] = ids.flatMap((id, i) => {
    const study = studies[i]?.data;
    const report = reports[i]?.data;
    return study && report
      ? [{ id, study, report, color: COLOURS[i % COLOURS.length] ?? '#12263a' }]
      : [];
  });
  return { ids, toggle, pending, failed, rows };
}

function parseIds(value: string): string[] {
  return value.split(',').filter(Boolean);
}
