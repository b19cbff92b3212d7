/** "Skip to content" for keyboard users: hidden until focused, jumps to the page's <main id="main">. */
export function SkipLink({ label }: { label: string }) {
  return (
    <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:p-2">
      {label}
    </a>
  );
}
