import { TENDENCY_CHARACTERISTIC_WORDS } from './pressure-tendency-words';

describe('TENDENCY_CHARACTERISTIC_WORDS', () => {
  it('when the code table is read, then every characteristic 0–8 has its words', () => {
    // WMO-No. 306, code table 0200 has the nine codes 0–8 (docs/references.md §5).
    expect(Object.keys(TENDENCY_CHARACTERISTIC_WORDS).map(Number)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8]);
  });

  it.each([
    [2, /^rising/, /higher$/],
    [4, /^steady/, /same/],
    [7, /^falling/, /lower$/],
  ] as const)('when a = %d, then the words say the curve and the net change as code table 0200 does', (code, curve, net) => {
    // docs/references.md §5: 2 rising, higher; 4 steady, the same; 7 falling, lower.
    expect(TENDENCY_CHARACTERISTIC_WORDS[code]).toMatch(curve);
    expect(TENDENCY_CHARACTERISTIC_WORDS[code]).toMatch(net);
  });
});
