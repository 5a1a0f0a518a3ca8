import { chartStartFromFileName, compileFileNamePattern, type CompiledFileNamePattern } from './file-name-pattern';

function compiled(pattern: string): CompiledFileNamePattern {
  const result = compileFileNamePattern(pattern);
  if (typeof result === 'string') throw new Error(result);
  return result;
}

describe('chartStartFromFileName', () => {
  it('reads a date at midnight UTC when the pattern has no time', () => {
    expect(chartStartFromFileName('KRO_1931-04-06.tif', compiled('KRO_{yyyy}-{MM}-{dd}'))).toBe('1931-04-06T00:00:00.000Z');
  });

  it('reads hours and minutes, with the literal text matched anywhere and case ignored', () => {
    expect(chartStartFromFileName('box3/kro_19310406_0815_scan.png', compiled('KRO_{yyyy}{MM}{dd}_{HH}{mm}'))).toBe('1931-04-06T08:15:00.000Z');
  });

  it('takes the name in the station time standard when an offset is given (UTC+1 → one hour earlier)', () => {
    expect(chartStartFromFileName('1931-04-06 08h.tif', compiled('{yyyy}-{MM}-{dd} {HH}h'), 60)).toBe('1931-04-06T07:00:00.000Z');
  });

  it('answers null for a name that does not match or an impossible date', () => {
    expect(chartStartFromFileName('WRO_1931-04-06.tif', compiled('KRO_{yyyy}-{MM}-{dd}'))).toBeNull();
    expect(chartStartFromFileName('KRO_1931-02-30.tif', compiled('KRO_{yyyy}-{MM}-{dd}'))).toBeNull();
    expect(chartStartFromFileName('KRO_1931-13-01.tif', compiled('KRO_{yyyy}-{MM}-{dd}'))).toBeNull();
    expect(chartStartFromFileName('19310406_2500', compiled('{yyyy}{MM}{dd}_{HH}{mm}'))).toBeNull();
  });

  it('treats regular-expression characters in the pattern as plain text', () => {
    expect(chartStartFromFileName('a.b(1931-04-06)', compiled('a.b({yyyy}-{MM}-{dd})'))).toBe('1931-04-06T00:00:00.000Z');
    expect(chartStartFromFileName('axb(1931-04-06)', compiled('a.b({yyyy}-{MM}-{dd})'))).toBeNull();
  });
});

describe('compileFileNamePattern', () => {
  it('names what is wrong with an unusable pattern', () => {
    expect(compileFileNamePattern('{yyyy}-{MM}')).toBe('the pattern needs {dd}');
    expect(compileFileNamePattern('{yyyy}{MM}{dd}{ss}')).toMatch(/unknown field \{ss\}/);
    expect(compileFileNamePattern('{yyyy}{MM}{dd}{yyyy}')).toBe('{yyyy} appears twice');
    expect(compileFileNamePattern('{yyyy}{MM}{dd}{HH')).toBe('a brace is not closed');
    expect(compileFileNamePattern('{yyyy}{MM}{dd}_{mm}')).toBe('the pattern has {mm} without {HH}');
  });
});
