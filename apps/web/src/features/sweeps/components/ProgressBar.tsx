/** A labelled bar of a job's progress, 0 to 1, shown as whole percent. */
export function ProgressBar({ value, label }: { value: number; label: string }) {
  const percent = Math.round(Math.min(1, Math.max(0, value)) * 100);
  return (
    <div>
      <div className="mb-1 flex justify-between text-xs">
        <span>{label}</span>
        <span className="num">{percent} %</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        className="h-3 overflow-hidden rounded-full bg-rule"
      >
        <div className="h-full bg-signal transition-[width]" style={{ width: `${percent}%` }} />
      </div>
    </div>
  );
}
