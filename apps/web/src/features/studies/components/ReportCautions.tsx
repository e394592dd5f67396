/** The report's cautions, as the library words them (those already shown beside their figures left out). */
export function ReportCautions({
  cautions,
  except = [],
}: {
  cautions: readonly string[];
  except?: readonly string[];
}) {
  const shown = cautions.filter((c) => !except.includes(c));
  if (!shown.length) return null;
  return (
    <section
      aria-label="Cautions"
      data-testid="cautions"
      className="border-l-4 border-signal bg-signal-soft p-3 text-xs print:break-inside-avoid"
    >
      <h2 className="mb-1 font-semibold tracking-wide uppercase">Cautions</h2>
      <ul className="flex flex-col gap-1">
        {shown.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
    </section>
  );
}
