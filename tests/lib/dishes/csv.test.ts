import { describe, expect, it } from 'vitest';
import { dishesToCsv, parseDishCsv, safeCell } from '@/lib/dishes';

describe('dish CSV', () => {
  it('a cell a spreadsheet would run as a formula is quoted on export and restored on import (OWASP CSV Injection)', () => {
    expect(safeCell('=HYPERLINK("x")')).toBe(`'=HYPERLINK("x")`);
    expect(safeCell('Rice')).toBe('Rice');
    const csv = dishesToCsv([
      { id: 'a', name: '=1+1 stew', method: 'boil', servingsPerBatch: 10, foodKgPerServing: 0.1, waterKgPerServing: 0.2, foodCpJPerKgK: 3500, litresPerServing: 0.3, minPotTempC: 90, holdMin: 10, safeCoreTempC: 74, lidOn: true, backupStove: 'lpg', notes: '@note', heatUpKWh: 0, batchHeatKWh: 0 },
    ]);
    expect(csv).toContain(`'=1+1 stew`);
    const back = parseDishCsv(csv);
    expect(back.errors).toEqual([]);
    expect(back.dishes[0]?.name).toBe('=1+1 stew');
    expect(back.dishes[0]?.notes).toBe('@note');
  });
});
