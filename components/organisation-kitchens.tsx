'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { KitchenList, type KitchenSummary } from './kitchen-list';
import { KitchenForm } from './kitchen-form';

/** The organisation's kitchens and the form to add one; the page's data is read again after an addition. */
export function OrganisationKitchens({ heading, kitchens }: { heading: string; kitchens: KitchenSummary[] }) {
  const router = useRouter();
  const [version, setVersion] = useState(0);
  return (
    <>
      <section aria-labelledby="org-kitchens">
        <h2 id="org-kitchens" className="mb-3 text-lg font-bold">{heading}</h2>
        <KitchenList kitchens={kitchens} />
      </section>
      <KitchenForm
        key={`form-${version}`}
        onSaved={() => {
          setVersion((v) => v + 1);
          router.refresh();
        }}
      />
    </>
  );
}
