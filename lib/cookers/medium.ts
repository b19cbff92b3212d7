import type { Cooker } from '@/entities';
import { getMedium } from '@/lib/materials';

/** The store medium of a cooker: built-in (lib/materials) or the organisation's custom table. */
export function cookerMedium(c: Pick<Cooker, 'mediumId' | 'customMedium'>): { kind: 'oil' | 'pcm' | 'custom'; name: string; smokePointC: number | null } {
  if (c.mediumId === 'custom') return { kind: 'custom', name: c.customMedium?.name ?? 'custom', smokePointC: c.customMedium?.smokePointC ?? null };
  const m = getMedium(c.mediumId);
  return { kind: m.kind, name: m.name, smokePointC: m.smokePointC ?? null };
}

