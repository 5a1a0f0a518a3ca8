import { findFrontCandidates } from './front-candidates';
import type { PressureAtTime } from './pressure-tendency';

const hourMs = 3_600_000;
const t0 = Date.UTC(2026, 2, 12, 0, 0);

/** Hourly (or finer) points, linear between (hour, hPa) knots. */
function series(knots: [number, number][], stepMinutes = 60): PressureAtTime[] {
  const points: PressureAtTime[] = [];
  const last = knots[knots.length - 1][0];
  for (let minutes = knots[0][0] * 60; minutes <= last * 60; minutes += stepMinutes) {
    const hour = minutes / 60;
    let k = 0;
    while (k < knots.length - 2 && knots[k + 1][0] < hour) k++;
    const [h1, p1] = knots[k];
    const [h2, p2] = knots[k + 1];
    points.push({ timeMs: t0 + minutes * 60_000, pressureHpa: p1 + ((p2 - p1) * (hour - h1)) / (h2 - h1) });
  }
  return points;
}

describe('findFrontCandidates', () => {
  it('when pressure falls 8 hPa to a minimum at 12 h and then rises 1.5 hPa/h, then one front candidate is suggested there', () => {
    // Frontal signature: falls ahead of the front, rises after it, front in the trough (docs/references.md §5: GMU CLIM 301; LibreTexts).
    const points = series([[0, 1010], [12, 1002], [18, 1011], [24, 1012]]);

    const candidates = findFrontCandidates(points).filter((c) => c.kind === 'front');

    expect(candidates).toHaveLength(1);
    expect(candidates[0].timeMs).toBe(t0 + 12 * hourMs);
    // Shoulders within ±6 h: 1006 hPa at 6 h, 1011 hPa at 18 h; depth below the lower one = 4 hPa.
    expect(candidates[0].depthHpa).toBeCloseTo(4, 9);
    expect(candidates[0].rateHpaPerHour).toBeCloseTo(1.5, 9);
  });

  it('when a minimum is followed by a slow rise of 0.3 hPa/h, then no front is suggested', () => {
    const points = series([[0, 1010], [12, 1004], [24, 1007.6]]);

    const candidates = findFrontCandidates(points);

    expect(candidates).toEqual([]);
  });

  it('when the rise after a minimum falls back by 1 hPa within 3 h, then it is not sustained and no front is suggested', () => {
    const points = series([[0, 1010], [12, 1002], [13, 1004], [14, 1003], [15, 1006], [24, 1009]]);

    const candidates = findFrontCandidates(points).filter((c) => c.kind === 'front');

    expect(candidates).toEqual([]);
  });

  it('when a semidiurnal-sized wave of ±1 hPa is all there is, then nothing is suggested', () => {
    // Tide amplitude ≈ 1 hPa at mid-latitudes (docs/references.md §5, from memory).
    const points = series(Array.from({ length: 49 }, (_, h) => [h, 1012 + Math.cos((2 * Math.PI * h) / 12)] as [number, number]));

    const candidates = findFrontCandidates(points);

    expect(candidates).toEqual([]);
  });

  it('when 10-minute points show a 3 hPa rise in 30 minutes, then one pressure jump is suggested at its foot', () => {
    // PRESRR: rising ≥ 0.06 inHg (≈ 2.0 hPa) per hour (AFMAN 15-111; NWS glossary; docs/references.md §5).
    const points = series([[0, 1005], [5, 1004.5], [5.5, 1007.5], [8, 1007.6]], 10);

    const jumps = findFrontCandidates(points).filter((c) => c.kind === 'pressure_jump');

    expect(jumps).toHaveLength(1);
    expect(jumps[0].timeMs).toBe(t0 + 5 * hourMs);
    expect(jumps[0].depthHpa).toBeCloseTo(3, 1);
    expect(jumps[0].rateHpaPerHour).toBeGreaterThanOrEqual(2);
  });

  it('when the rise is 1.5 hPa per hour, below the PRESRR 2.0 hPa/h, then no jump is suggested', () => {
    const points = series([[0, 1005], [5, 1005], [6, 1006.5], [8, 1006.5]], 10);

    const jumps = findFrontCandidates(points).filter((c) => c.kind === 'pressure_jump');

    expect(jumps).toEqual([]);
  });

  it('when a gap splits the series at the minimum, then no candidate bridges it', () => {
    const points = series([[0, 1010], [12, 1002], [18, 1011], [24, 1012]]).map((p) =>
      p.timeMs > t0 + 11 * hourMs && p.timeMs < t0 + 16 * hourMs ? { ...p, pressureHpa: null } : p,
    );

    const candidates = findFrontCandidates(points).filter((c) => c.kind === 'front');

    expect(candidates).toEqual([]);
  });
});
