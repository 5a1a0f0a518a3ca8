import { lineDifferences } from './line-difference';

describe('lineDifferences', () => {
  it('when two lines share times, then b − a is given at those only, marked beyond 2·√(u_a² + u_b²)', () => {
    const a = [
      { time: '2026-03-02T00:00:00.000Z', pressureHpa: 1000, uncertaintyHpa: 0.1, flag: 'ok' as const },
      { time: '2026-03-02T01:00:00.000Z', pressureHpa: 1000, uncertaintyHpa: 0.1, flag: 'ok' as const },
      { time: '2026-03-02T02:00:00.000Z', pressureHpa: 1000, uncertaintyHpa: 0.1, flag: 'ok' as const },
    ];
    const b = [
      { time: '2026-03-02T01:00:00.000Z', pressureHpa: 1000.2, uncertaintyHpa: 0.1, flag: 'ok' as const },
      { time: '2026-03-02T02:00:00.000Z', pressureHpa: 1000.3, uncertaintyHpa: 0.1, flag: 'ok' as const },
    ];

    const differences = lineDifferences(a, b);

    // 2·√(0.01 + 0.01) = 0.283 hPa: 0.2 is within it, 0.3 beyond (worked by hand).
    expect(differences.map((d) => d.isBeyondUncertainty)).toEqual([false, true]);
    expect(differences[0].differenceHpa).toBeCloseTo(0.2, 9);
    expect(differences[0].timeMs).toBe(Date.parse('2026-03-02T01:00:00.000Z'));
  });
});
