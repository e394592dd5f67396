/** One headline figure: what it is, its value with unit, and a note on what it is of. */
export interface Figure {
  label: string;
  value: string;
  note?: string | undefined;
  /** Colours the value: a pass or a fail. */
  tone?: 'good' | 'bad' | undefined;
}

/** A grid of figure cards; each value carries `data-figure` = its label (browser tests read them). */
export function FigureCards({
  figures,
  label = 'Figures',
}: {
  figures: readonly Figure[];
  label?: string;
}) {
  return (
    <dl
      className="grid grid-cols-2 gap-2 sm:grid-cols-3 xl:grid-cols-4 print:grid-cols-4"
      aria-label={label}
    >
      {figures.map((f) => (
        <div
          key={f.label}
          className="rounded-lg border border-rule bg-panel px-3 py-2 shadow-sm print:break-inside-avoid"
        >
          <dt className="text-xs tracking-wide text-ink-soft uppercase">{f.label}</dt>
          <dd
            className={`num text-lg font-semibold ${f.tone === 'good' ? 'text-good' : f.tone === 'bad' ? 'text-bad' : ''}`}
            data-figure={f.label}
          >
            {f.value}
          </dd>
          {f.note ? <dd className="text-[11px] leading-snug text-ink-soft">{f.note}</dd> : null}
        </div>
      ))}
    </dl>
  );
}
