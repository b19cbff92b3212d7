/**
 * The cooker model's public contract (inputs and results of simulateCooker).
 * Everything here is plain data so it serialises to JSON for the API, the worker and the planner.
 * Times are epoch milliseconds (UTC); temperatures °C; powers W; energies J.
 */

/** Collector useful-gain model. */
export type CollectorSpec =
  | {
      /** ISO 9806 quasi-steady form: Q = A·(η0·G − a1·(Tm−Ta) − a2·(Tm−Ta)²). */
      model: 'iso9806';
      apertureM2: number;
      eta0: number;
      /** [W/(m²·K)] */
      a1: number;
      /** [W/(m²·K²)] */
      a2: number;
    }
  | {
      /** Lumped form: Q = η0·A·G − U_loss·(T−Ta). */
      model: 'lumped';
      apertureM2: number;
      eta0: number;
      /** [W/K] */
      uLossWPerK: number;
    };

export interface StoreSpec {
  /** Id of a built-in medium (lib/materials) or a custom medium given inline. */
  mediumId: string;
  /** Custom medium as a table of values; used when mediumId === 'custom'. */
  customTable?: {
    name: string;
    /** rows sorted by tC: density [kg/m³], cp [J/(kg·K)], k [W/(m·K)], viscosity [Pa·s] */
    rows: { tC: number; density: number; cp: number; k: number; viscosity: number }[];
    smokePointC?: number;
  };
  /** Mass of the storage medium [kg]. */
  massKg: number;
  /** Heat-loss coefficient of the store's insulated shell to ambient [W/K] (wind-independent part). */
  uaLossWPerK: number;
  /** Extra loss per m/s of wind [W/(K·(m/s))]; optional, default 0. */
  uaWindWPerKPerMS?: number;
  /** 1 = well mixed (default); N > 1 = stratified store of N equal layers, collector heats the bottom layer. */
  nodes?: number;
  /** Highest safe store temperature [°C]; above it the collector is assumed defocused and the excess is spilled. */
  maxSafeTempC: number;
  /** Lowest useful store temperature [°C]; state of charge is 0 % here. */
  minUsefulTempC: number;
}

export interface PotSpec {
  id: string;
  /** Usable volume [L]. */
  volumeL: number;
  /** Empty pot mass [kg] and its specific heat [J/(kg·K)] (aluminium ≈ 900, steel ≈ 500). */
  massKg: number;
  cpJPerKgK: number;
  /** Store-to-pot coupling: a fitted constant [W/K], or computed by natural convection from the contact area. */
  coupling: { kind: 'constant'; uaWPerK: number } | { kind: 'natural-convection'; contactAreaM2: number };
  /** Lid area exposed to air [m²] and its loss coefficient [W/(m²·K)] with the lid on; lid off multiplies losses and allows open evaporation. */
  lidAreaM2: number;
  lidUWPerM2K: number;
}

export interface CookerSpec {
  collector: CollectorSpec;
  store: StoreSpec;
  pots: PotSpec[];
}

export type { WeatherStep } from '@/lib/weather-step';

/** A batch of food cooking in one pot. */
export interface PotLoad {
  /** Free identifier echoed back in the results (e.g. the batch id). */
  id: string;
  potId: string;
  /** When the filled pot goes onto the store [epoch ms]. */
  startMs: number;
  /** Food (non-water) mass [kg] and its specific heat [J/(kg·K)]; water mass [kg]. */
  foodKg: number;
  foodCpJPerKgK: number;
  waterKg: number;
  /** Initial temperature of the contents [°C] (defaults to the air temperature). */
  initialTempC?: number;
  lidOn: boolean;
  /**
   * When the batch ends: after holding ≥ minTempC for holdS seconds (dynamic end),
   * or at a fixed time. A batch that never reaches minTempC ends at maxEndMs.
   */
  minTempC: number;
  holdS: number;
  /** Hard stop [epoch ms] (e.g. serve-by); the pot is removed then whatever happened. */
  maxEndMs: number;
}

export interface SimulateOptions {
  /** Integration/output step [s]; default 60. */
  stepS?: number;
  /** Store temperature at the first step [°C] (all layers). */
  initialStoreTempC: number;
  /** Kitchen altitude [m], for the boiling point. */
  altitudeM: number;
  loads?: PotLoad[];
}

export interface LoadOutcome {
  id: string;
  potId: string;
  startMs: number;
  /** First time the pot reached minTempC [epoch ms], or null. */
  reachedMs: number | null;
  /** When the batch finished holding (reachedMs + holdS) or null if it did not complete before maxEndMs. */
  doneMs: number | null;
  /** When the pot was taken off [epoch ms]. */
  endMs: number;
  /** Energy drawn from the store by this batch [J]. */
  drawnJ: number;
  /** Water boiled off [kg]. */
  evaporatedKg: number;
  /** Highest pot temperature reached [°C]. */
  maxPotTempC: number;
  ok: boolean;
}

export interface SimulationSeries {
  /** Step start times [epoch ms], length n+1 (state at each step boundary). */
  t: number[];
  /** Store temperature (mean of layers) [°C]. */
  storeTempC: number[];
  /** Top-layer temperature [°C] (equals storeTempC for a well-mixed store). */
  storeTopTempC: number[];
  /** Pot temperature per pot id [°C]; NaN while the pot is empty/off. */
  potTempC: Record<string, number[]>;
  /** State of charge [0..1]. */
  charge: number[];
  /** Per-step (length n) mean powers [W]. */
  gainW: number[];
  lossW: number[];
  drawW: number[];
  spillW: number[];
}

export interface EnergyBalance {
  /** Totals over the run [J]. */
  gainJ: number;
  lossJ: number;
  drawJ: number;
  spillJ: number;
  /** Change of stored energy (enthalpy) [J]. */
  storedChangeJ: number;
  /** |gain − loss − draw − spill − storedChange| / max(gain, |storedChange|, 1) */
  relativeError: number;
}

export interface SimulationEvent {
  kind: 'pot-reached' | 'batch-done' | 'charge-below' | 'store-max-safe' | 'store-below-useful';
  tMs: number;
  detail: string;
  loadId?: string;
}

export interface SimulationResult {
  series: SimulationSeries;
  loads: LoadOutcome[];
  balance: EnergyBalance;
  events: SimulationEvent[];
}
