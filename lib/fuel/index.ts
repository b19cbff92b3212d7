/** Backup fuel estimates: energy per batch, fuel mass or kWh, cost and CO₂ (IPCC 2006 factors). */
export * from './factors';
export * from './energy';
export * from './backup';
