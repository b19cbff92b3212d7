import type { DishInput } from '@/lib/validations/dishes';

/**
 * Demo dish library and menus (invented; per-serving masses and temperatures are plausible values,
 * "common practice, no source"; safe core temperatures follow the USDA FSIS chart: 74 °C for
 * poultry and leftovers, 71 °C for egg dishes).
 */
export const DEMO_DISHES: DishInput[] = [
  { name: 'Maize porridge', method: 'boil', servingsPerBatch: 120, foodKgPerServing: 0.06, waterKgPerServing: 0.25, foodCpJPerKgK: 1800, litresPerServing: 0.33, minPotTempC: 90, holdMin: 20, safeCoreTempC: 74, lidOn: true, backupStove: 'lpg', notes: null },
  { name: 'Millet porridge', method: 'boil', servingsPerBatch: 120, foodKgPerServing: 0.05, waterKgPerServing: 0.25, foodCpJPerKgK: 1800, litresPerServing: 0.33, minPotTempC: 90, holdMin: 15, safeCoreTempC: 74, lidOn: true, backupStove: 'lpg', notes: null },
  { name: 'Rice', method: 'boil', servingsPerBatch: 130, foodKgPerServing: 0.08, waterKgPerServing: 0.16, foodCpJPerKgK: 1800, litresPerServing: 0.3, minPotTempC: 90, holdMin: 20, safeCoreTempC: 74, lidOn: true, backupStove: 'lpg', notes: 'Keep the lid on; stir once.' },
  { name: 'Bean stew', method: 'simmer', servingsPerBatch: 100, foodKgPerServing: 0.15, waterKgPerServing: 0.2, foodCpJPerKgK: 3300, litresPerServing: 0.4, minPotTempC: 88, holdMin: 60, safeCoreTempC: 74, lidOn: true, backupStove: 'three-stone-wood', notes: 'Soak the beans the evening before.' },
  { name: 'Lentil dal', method: 'simmer', servingsPerBatch: 110, foodKgPerServing: 0.07, waterKgPerServing: 0.25, foodCpJPerKgK: 3300, litresPerServing: 0.35, minPotTempC: 88, holdMin: 35, safeCoreTempC: 74, lidOn: true, backupStove: 'lpg', notes: null },
  { name: 'Vegetable stew', method: 'simmer', servingsPerBatch: 110, foodKgPerServing: 0.2, waterKgPerServing: 0.1, foodCpJPerKgK: 3700, litresPerServing: 0.35, minPotTempC: 85, holdMin: 25, safeCoreTempC: 74, lidOn: true, backupStove: 'lpg', notes: null },
  { name: 'Chicken stew', method: 'simmer', servingsPerBatch: 100, foodKgPerServing: 0.2, waterKgPerServing: 0.15, foodCpJPerKgK: 3500, litresPerServing: 0.4, minPotTempC: 88, holdMin: 45, safeCoreTempC: 74, lidOn: true, backupStove: 'charcoal', notes: 'Poultry: reach 74 °C in the thickest piece.' },
  { name: 'Steamed sweet potato', method: 'steam', servingsPerBatch: 90, foodKgPerServing: 0.25, waterKgPerServing: 0.05, foodCpJPerKgK: 3500, litresPerServing: 0.45, minPotTempC: 90, holdMin: 30, safeCoreTempC: 74, lidOn: true, backupStove: 'lpg', notes: null },
  { name: 'Fried dough bites', method: 'fry', servingsPerBatch: 60, foodKgPerServing: 0.08, waterKgPerServing: 0, foodCpJPerKgK: 2500, litresPerServing: 0.25, minPotTempC: 165, holdMin: 15, safeCoreTempC: 74, lidOn: false, backupStove: 'lpg', notes: 'Lower the dough in slowly; never leave the pot.' },
];

/** Each kitchen's menu (dish, servings, serve-by and earliest start, local time), used for today and tomorrow. */
export const DEMO_MENUS: Record<string, { dish: string; servings: number; serveBy: string; earliestStart?: string }[]> = {
  baobab: [
    { dish: 'Maize porridge', servings: 300, serveBy: '10:00', earliestStart: '07:00' },
    { dish: 'Rice', servings: 300, serveBy: '12:30' },
    { dish: 'Bean stew', servings: 300, serveBy: '12:30' },
  ],
  tamarind: [
    { dish: 'Millet porridge', servings: 120, serveBy: '08:00' },
    { dish: 'Vegetable stew', servings: 240, serveBy: '12:30' },
    { dish: 'Rice', servings: 240, serveBy: '12:30' },
    { dish: 'Chicken stew', servings: 120, serveBy: '18:30', earliestStart: '13:00' },
  ],
  saltbush: [
    { dish: 'Lentil dal', servings: 350, serveBy: '12:30' },
    { dish: 'Rice', servings: 350, serveBy: '12:30' },
    { dish: 'Fried dough bites', servings: 100, serveBy: '16:30', earliestStart: '13:00' },
    { dish: 'Steamed sweet potato', servings: 100, serveBy: '18:00', earliestStart: '13:00' },
  ],
};
