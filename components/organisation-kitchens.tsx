'use client';

import { useState } from 'react';
import { KitchenList } from './kitchen-list';
import { KitchenForm } from './kitchen-form';

/** The organisation's kitchens and the form to add one; the list reloads after an addition. */
export function OrganisationKitchens({ heading }: { heading: string }) {
  const [version, setVersion] = useState(0);
  return (
    <>
      <section aria-labelledby="org-kitchens">
        <h2 id="org-kitchens" className="mb-3 text-lg font-bold">{heading}</h2>
        <KitchenList key={version} />
      </section>
      <KitchenForm key={`form-${version}`} onSaved={() => setVersion((v) => v + 1)} />
    </>
  );
}
