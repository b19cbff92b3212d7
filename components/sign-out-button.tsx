'use client';

import { useRouter } from 'next/navigation';

/** Sign-out for pages without the app shell (its label comes from the server). */
export function SignOutButton({ label }: { label: string }) {
  const router = useRouter();
  return (
    <button
      type="button"
      className="min-h-12 rounded-md border border-clay-200 px-3 text-sm font-semibold"
      onClick={async () => {
        await fetch('/api/v1/session', { method: 'DELETE' }).catch(() => undefined);
        router.push('/sign-in');
        router.refresh();
      }}
    >
      {label}
    </button>
  );
}
