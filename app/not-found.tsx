import Link from 'next/link';

export default function NotFound() {
  return (
    <main id="main" className="mx-auto max-w-md px-4 py-16 text-center">
      <h1 className="mb-2 text-2xl font-bold">404</h1>
      <p className="mb-4">This page does not exist or you cannot see it. · Cette page n&apos;existe pas ou vous ne pouvez pas la voir.</p>
      <Link href="/" className="btn-quiet">Hearthcast</Link>
    </main>
  );
}
