/** Storage media for Hearthcast stores: vegetable oils, phase-change materials and custom tables. */
export type { MediumKind, StorageMedium } from './types';
export { createPiecewiseLinearEnthalpy, type HeatCapacitySegment, type PiecewiseEnthalpy } from './enthalpy';
export {
  createVegetableOil,
  fitVogelFulcherTammann,
  oilConductivityTurgut2009,
  oilSpecificHeatFasinaColley2008,
  OIL_VISCOSITY_SHAPE,
  OILS,
  sunflowerOil,
  palmOil,
  soybeanOil,
  rapeseedOil,
  cottonseedOil,
  type OilParameters,
} from './oils';
export {
  createPhaseChangeMaterial,
  liquidFractionEnthalpyMethod,
  erythritol,
  magnesiumChlorideHexahydrate,
  dMannitol,
  acetanilide,
  solarSalt,
  solarSaltViscosityZavoico2001PaS,
  ERYTHRITOL_LATENT_J_PER_KG,
  ERYTHRITOL_MELT_C,
  ERYTHRITOL_MOLAR_MASS_KG_PER_MOL,
  PCMS,
  type PcmParameters,
} from './pcm';
export { createCustomMedium, validateCustomTable, type CustomMediumRow, type CustomMediumTable } from './custom';
export { getMedium, hasMedium, listMedia, listMediumIds } from './registry';
