import { describe, expect, it } from 'vitest';
import { formatMessage } from '@/components/mini-intl';
import en from '@/lib/i18n/messages/en.json';
import fr from '@/lib/i18n/messages/fr.json';

describe('the Today page message formatter', () => {
  it('fills arguments and plural cases like ICU MessageFormat (Unicode CLDR plural rules via Intl.PluralRules)', () => {
    expect(formatMessage('Hello {name}', { name: 'Zawadi' }, 'en')).toBe('Hello Zawadi');
    const p = '{count, plural, =0 {nothing} one {# entry} other {# entries}}';
    expect(formatMessage(p, { count: 0 }, 'en')).toBe('nothing');
    expect(formatMessage(p, { count: 1 }, 'en')).toBe('1 entry');
    expect(formatMessage(p, { count: 1200 }, 'en')).toBe('1,200 entries');
    // French: 0 and 1 are "one" (CLDR), and the thousands separator is a narrow no-break space.
    expect(formatMessage('{count, plural, one {# lot} other {# lots}}', { count: 0 }, 'fr')).toBe('0 lot');
    expect(formatMessage('{count, plural, one {# lot} other {# lots}}', { count: 2 }, 'fr')).toBe('2 lots');
  });

  it('formats every Today and safety message of both languages without leaving a brace behind', () => {
    const names = 'date version time count message temp store pot dish index of servings duration unit min max cooker smoke fuel amount minTemp serveBy who storeC smokeC meltC meltLowC meltHighC maxSafeC peakC coreC holdC sun backup ready';
    const params = Object.fromEntries(names.split(' ').map((n) => [n, n === 'count' ? 2 : 'x']));
    for (const messages of [en, fr]) {
      for (const ns of ['today', 'safety'] as const) {
        const walk = (node: unknown): void => {
          if (typeof node === 'string') expect(formatMessage(node, params, 'en')).not.toMatch(/[{}]/);
          else if (node && typeof node === 'object') Object.values(node).forEach(walk);
        };
        walk(messages[ns]);
      }
    }
  });
});
