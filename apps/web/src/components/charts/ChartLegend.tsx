/** The legend under a chart: one swatch and name per series, a short line or a small square. */
export function ChartLegend({
  series,
  swatch,
}: {
  series: readonly { name: string; color: string }[];
  swatch: 'line' | 'square';
}) {
  const swatchClass =
    swatch === 'line' ? 'inline-block h-0.5 w-4' : 'inline-block h-2.5 w-2.5 rounded-sm';
  return (
    <ul className="mt-1 flex flex-wrap gap-3 text-xs" aria-label="Legend">
      {series.map((s) => (
        <li key={s.name} className="flex items-center gap-1">
          <span className={swatchClass} style={{ background: s.color }} />
          {s.name}
        </li>
      ))}
    </ul>
  );
}
