import { describe, expect, it } from 'vitest';
import { budgetMinFromText, budgetMinText } from './budget-filter';

describe('budget filter in major units', () => {
  it('turns "250" and "250.50" dollars into cents', () => {
    expect(budgetMinFromText('250', 'USD')).toEqual({ ok: true, budgetMin: 25000 });
    expect(budgetMinFromText(' 250.50 ', 'USD')).toEqual({ ok: true, budgetMin: 25050 });
  });

  it('keeps yen whole, since the currency has no minor unit', () => {
    expect(budgetMinFromText('30000', 'JPY')).toEqual({ ok: true, budgetMin: 30000 });
    expect(budgetMinFromText('1.5', 'JPY').ok).toBe(false);
  });

  it('leaves the filter off when the field is empty', () => {
    expect(budgetMinFromText('  ', 'GBP')).toEqual({ ok: true, budgetMin: undefined });
  });

  it('refuses text, negative amounts and a third decimal with a message', () => {
    for (const bad of ['abc', '-5', '12.345']) {
      const result = budgetMinFromText(bad, 'EUR');
      expect(result.ok).toBe(false);
      if (!result.ok) expect(result.message.length).toBeGreaterThan(0);
    }
  });

  it('shows a stored filter back in major units', () => {
    expect(budgetMinText(25050, 'GBP')).toBe('250.50');
    expect(budgetMinText(30000, 'JPY')).toBe('30000');
    expect(budgetMinText(undefined, 'USD')).toBe('');
  });
});
