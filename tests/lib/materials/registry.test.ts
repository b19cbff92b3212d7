import { describe, expect, it } from 'vitest';
import { getMedium, listMedia, listMediumIds } from '@/lib/materials';

describe('medium registry', () => {
  it('lists the five oils and five PCMs with unique ids', () => {
    const ids = listMediumIds();
    expect(ids).toHaveLength(10);
    expect(new Set(ids).size).toBe(10);
    expect(listMedia().filter((m) => m.kind === 'oil')).toHaveLength(5);
    expect(listMedia().filter((m) => m.kind === 'pcm')).toHaveLength(5);
  });

  it('getMedium returns the medium by id', () => {
    expect(getMedium('sunflower-oil').name).toMatch(/Sunflower/);
    expect(getMedium('erythritol').melting).toBeDefined();
  });

  it('getMedium throws a RangeError listing the known ids', () => {
    expect(() => getMedium('olive-oil')).toThrow(RangeError);
    expect(() => getMedium('olive-oil')).toThrow(/known ids: sunflower-oil, palm-oil, soybean-oil, rapeseed-oil, cottonseed-oil, erythritol/);
    expect(() => getMedium('custom')).toThrow(/createCustomMedium/);
  });
});
