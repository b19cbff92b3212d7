/**
 * Registry of the built-in storage media: getMedium(id) and listMedia().
 * A custom medium is not in the registry; build it with createCustomMedium(table).
 */
import { OILS } from './oils';
import { PCMS } from './pcm';
import type { StorageMedium } from './types';

const BUILT_IN: readonly StorageMedium[] = [...OILS, ...PCMS];
const BY_ID: ReadonlyMap<string, StorageMedium> = new Map(BUILT_IN.map((m) => [m.id, m]));

/** Ids of the built-in media, in display order (oils first, then phase-change materials). */
export function listMediumIds(): string[] {
  return BUILT_IN.map((m) => m.id);
}

/** All built-in media (oils first, then phase-change materials). */
export function listMedia(): readonly StorageMedium[] {
  return BUILT_IN;
}

/** True when id names a built-in medium. */
export function hasMedium(id: string): boolean {
  return BY_ID.has(id);
}

/**
 * The built-in medium with this id.
 * @throws RangeError whose message lists the known ids (and points to createCustomMedium for "custom").
 */
export function getMedium(id: string): StorageMedium {
  const m = BY_ID.get(id);
  if (m) return m;
  const hint = id === 'custom' ? ' (a custom medium is built from its table with createCustomMedium)' : '';
  throw new RangeError(`Unknown storage medium "${id}"${hint}; known ids: ${listMediumIds().join(', ')}`);
}
