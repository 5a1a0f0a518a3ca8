import { auditFieldLabel, auditValueText } from './audit-value-text';

describe('auditValueText', () => {
  it.each<[unknown, string]>([
    [null, '—'],
    ['', '—'],
    [[], '—'],
    [['gale', 'torn corner'], 'gale, torn corner'],
    [150, '150'],
    ['B14', 'B14'],
    [{ x: 1 }, '{"x":1}'],
  ])('when the value is %p, then it reads %p', (value, text) => {
    expect(auditValueText(value)).toBe(text);
  });
});

describe('auditFieldLabel', () => {
  it('when a known field is shown, then it uses the catalogue word', () => {
    expect(auditFieldLabel('chartFormId')).toBe('chart form');
  });

  it('when another camelCase field is shown, then it is spelt out in lower case', () => {
    expect(auditFieldLabel('barometerReading')).toBe('barometer reading');
  });
});
