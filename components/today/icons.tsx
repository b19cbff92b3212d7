/**
 * Small inline icons for the cook's page: drawn as SVG so they look the same on every phone (emoji
 * differ between systems and some cheap phones show them as boxes). Decorative: the text beside each
 * says what it means.
 */
export function LevelIcon({ level, className = 'h-5 w-5 shrink-0' }: { level: 'danger' | 'warning' | 'info'; className?: string }) {
  if (level === 'danger')
    return (
      <svg viewBox="0 0 20 20" aria-hidden="true" className={className}>
        <circle cx="10" cy="10" r="9" fill="currentColor" />
        <rect x="5" y="8.5" width="10" height="3" rx="1" fill="white" />
      </svg>
    );
  if (level === 'warning')
    return (
      <svg viewBox="0 0 20 20" aria-hidden="true" className={className}>
        <path d="M10 1.5 19 18H1z" fill="currentColor" />
        <rect x="9" y="7" width="2" height="6" fill="white" />
        <rect x="9" y="14.5" width="2" height="2" fill="white" />
      </svg>
    );
  return (
    <svg viewBox="0 0 20 20" aria-hidden="true" className={className}>
      <circle cx="10" cy="10" r="9" fill="none" stroke="currentColor" strokeWidth="2" />
      <rect x="9" y="8.5" width="2" height="6.5" fill="currentColor" />
      <rect x="9" y="5" width="2" height="2" fill="currentColor" />
    </svg>
  );
}
