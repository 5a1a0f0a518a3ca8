import { changeLogFieldLabel, changeLogValueText } from './change-log-text';

describe('changeLogValueText', () => {
  it.each<[unknown, string]>([
    [null, '—'],
    ['', '—'],
    [[], '—'],
    [['gale', 'torn corner'], 'gale, torn corner'],
    [150, '150'],
    ['B14', 'B14'],
    [{ x: 1 }, '{"x":1}'],
  ])('when the value is %p, then it reads %p', (value, text) => {
    expect(changeLogValueText(value)).toBe(text);
  });
});

describe('changeLogValueText with the entry\'s names', () => {
  it('when the value is an id the server named, then the name is shown instead of the id', () => {
    expect(changeLogValueText('7f0c-station', 'stationId', { '7f0c-station': 'Kremsmünster' })).toBe('Kremsmünster');
  });

  it('when the field is the status, then the code is shown in words', () => {
    expect(changeLogValueText('ready_to_trace', 'status')).toBe('ready to trace');
  });

  it('when an id has no name (its row is gone), then the id itself is shown', () => {
    expect(changeLogValueText('gone-id', 'stationId', {})).toBe('gone-id');
  });
});

describe('changeLogFieldLabel', () => {
  it('when a known field is shown, then it uses the catalogue word', () => {
    expect(changeLogFieldLabel('chartFormId')).toBe('chart form');
  });

  it('when another camelCase field is shown, then it is spelt out in lower case', () => {
    expect(changeLogFieldLabel('barometerReading')).toBe('barometer reading');
  });
});
