/**
 * Regression: a molten PCM must drive natural convection at the pot like any liquid. With a constant
 * liquid density (β = 0) the Rayleigh number vanished and a pot on an erythritol store barely warmed.
 */
import { describe, expect, it } from 'vitest';
import { getMedium } from '@/lib/materials';
import { filmProperties, potCouplingNaturalConvectionWPerK } from '@/lib/thermal';

describe('pot coupling on a molten phase-change store', () => {
  it.each(['erythritol', 'magnesium-chloride-hexahydrate', 'd-mannitol', 'acetanilide'])('%s melt has a positive expansion coefficient', (id) => {
    const m = getMedium(id);
    const t = (m.melting?.liquidusC ?? 100) + 20;
    // Organic and salt-hydrate melts expand by roughly 3e-4 to 1e-3 per kelvin (typical of liquids; from memory).
    const beta = (m.density(t - 0.5) - m.density(t + 0.5)) / m.density(t);
    expect(beta).toBeGreaterThan(2e-4);
    expect(beta).toBeLessThan(2e-3);
  });

  it('erythritol at 150 °C couples to a 60 °C pot within a factor of 5 of sunflower oil', () => {
    const ery = potCouplingNaturalConvectionWPerK(getMedium('erythritol'), 150, 60, 0.32, 50);
    const oil = potCouplingNaturalConvectionWPerK(getMedium('sunflower-oil'), 150, 60, 0.32, 50);
    expect(ery).toBeGreaterThan(oil / 5);
    expect(filmProperties(getMedium('erythritol'), 130)?.betaPerK).toBeGreaterThan(0);
    // Not more than twice the oil either: the melt is more viscous than hot sunflower oil.
    expect(ery).toBeLessThan(oil * 2);
  });
});
