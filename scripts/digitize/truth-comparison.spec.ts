import { parseTruthCsv, scoreSeries, truthAt } from './truth-comparison';

const CSV = ['time,pressure_hpa,inked', '2026-03-02T00:00:00Z,1000.00,1', '2026-03-02T00:10:00Z,1001.00,0', '2026-03-02T00:20:00Z,1002.00,1'].join('\n');

describe('truth comparison', () => {
  it('when a time falls exactly on an inked row before a pen skip, then it counts as inked', () => {
    const truth = parseTruthCsv(CSV);

    const onRow = truthAt(truth, Date.parse('2026-03-02T00:00:00Z'));
    const between = truthAt(truth, Date.parse('2026-03-02T00:05:00Z'));

    expect(onRow).toEqual({ timeMs: Date.parse('2026-03-02T00:00:00Z'), pressureHpa: 1000, isInked: true });
    expect(between?.isInked).toBe(false);
    expect(between?.pressureHpa).toBeCloseTo(1000.5, 9);
  });

  it('when a series is scored, then off-scale and skipped times are kept out of the error and gaps are counted', () => {
    const truth = parseTruthCsv(CSV);
    const t = (minutes: number) => Date.parse('2026-03-02T00:00:00Z') + minutes * 60_000;

    const score = scoreSeries(
      [
        { timeMs: t(0), pressureHpa: 1000.3, flag: 'ok', uncertaintyHpa: null },
        { timeMs: t(10), pressureHpa: null, flag: 'gap', uncertaintyHpa: null },
        { timeMs: t(20), pressureHpa: 999, flag: 'off_scale', uncertaintyHpa: null },
      ],
      truth,
    );

    expect(score.rmseHpa).toBeCloseTo(0.3, 9);
    expect(score.comparedPoints).toBe(1);
    expect(score.gapsFlagged).toBe(1);
    expect(score.inkedRecovered).toBe(1);
  });
});
