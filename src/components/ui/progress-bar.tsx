/** Long work shows how far it is and what it is doing. */
export function ProgressBar({ fraction, label }: { fraction: number; label: string }) {
  const pct = Math.round(Math.min(1, Math.max(0, fraction)) * 100);
  return (
    <div>
      <div className="mb-1 flex justify-between text-sm">
        <span className="text-ink-soft">{label}</span>
        {/* "0 %" says nothing: until the work reports progress only what it is doing is shown. */}
        {pct > 0 && <span className="num font-semibold">{pct} %</span>}
      </div>
      <div
        role="progressbar"
        aria-valuenow={pct}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-label={label}
        className="h-2.5 overflow-hidden rounded-full bg-paper-deep"
      >
        <div className="h-full rounded-full bg-copper transition-[width] duration-500" style={{ width: `${pct}%` }} />
      </div>
    </div>
  );
}
