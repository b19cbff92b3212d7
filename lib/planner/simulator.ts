/**
 * The default simulator: lib/thermal's simulateCooker.
 */
import { simulateCooker } from '@/lib/thermal';
import type { SimulateFn } from './types';

export function getDefaultSimulate(): Promise<SimulateFn> {
  return Promise.resolve(simulateCooker);
}
