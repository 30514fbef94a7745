/** LoopLedger's mark: a closed loop drawn as a ledger line with a drop. */
export function Logo({ className = "" }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 font-semibold tracking-tight ${className}`}>
      <svg width="22" height="22" viewBox="0 0 24 24" aria-hidden="true">
        <rect x="2.5" y="5" width="19" height="14" rx="7" fill="none" stroke="currentColor" strokeWidth="2.2" />
        <path d="M12 8.2c1.9 2.4 2.8 3.9 2.8 5a2.8 2.8 0 0 1-5.6 0c0-1.1.9-2.6 2.8-5z" fill="#d9854a" />
      </svg>
      <span>
        Loop<span className="text-basin-500">Ledger</span>
      </span>
    </span>
  );
}
