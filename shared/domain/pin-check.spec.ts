import { paperFromReading } from './chart-geometry';
import { checkPins } from './pin-check';
import { TEST_WEEKLY_FORM } from './testing/test-weekly-form';

const form = TEST_WEEKLY_FORM;
const PX_PER_MM = 150 / 25.4;
const ANGLE = (0.8 * Math.PI) / 180;

/** An invented scan of the test form: 150 dpi, turned 0.8°, the pressureMin line 600 px down. */
function toPixel(reading: { hours: number; pressure: number }) {
  const paper = paperFromReading(form, reading);
  const x = paper.uMm * Math.cos(ANGLE) - paper.vMm * Math.sin(ANGLE);
  const y = paper.uMm * Math.sin(ANGLE) + paper.vMm * Math.cos(ANGLE);
  return { xPx: 100 + x * PX_PER_MM, yPx: 600 - y * PX_PER_MM };
}
const pin = (hours: number, pressure: number) => ({ ...toPixel({ hours, pressure }), hours, pressure });
const GOOD_PINS = [pin(12, 1040), pin(156, 1040), pin(156, 960), pin(12, 960), pin(84, 1000)];

describe('checkPins', () => {
  it('when fewer than 3 pins are placed, then there is no grid yet', () => {
    expect(checkPins(form, GOOD_PINS.slice(0, 2))).toEqual({ kind: 'too_few' });
  });

  it('when the pins are exact, then each residual is nil, none is an outlier, and the ghost grid has every printed line', () => {
    const check = checkPins(form, GOOD_PINS);

    if (check.kind !== 'fitted') throw new Error(`expected a fit, got ${check.kind}`);
    // 101 pressure lines and 85 time lines: the form's grid (chart-grid.spec.ts); the geometry is ghost-grid.spec.ts's.
    expect(check.grid).toHaveLength(101 + 85);
    expect(check.pins).toHaveLength(5);
    for (const pinCheck of check.pins) {
      expect(Math.abs(pinCheck.pressureHpa)).toBeLessThan(1e-6);
      expect(Math.abs(pinCheck.minutes)).toBeLessThan(1e-6);
      expect(pinCheck.isOutlier).toBe(false);
    }
  });

  it('when the last of four corner pins is typed for the wrong time line, then it is the one marked', () => {
    // Four corners share one bad pin's error equally in a least-squares fit; only refitting without it names it.
    const pins = [...GOOD_PINS.slice(0, 3), { ...pin(12, 960), hours: 8 }];

    const check = checkPins(form, pins);

    if (check.kind !== 'fitted') throw new Error(`expected a fit, got ${check.kind}`);
    expect(check.pins.map((pinCheck) => pinCheck.isOutlier)).toEqual([false, false, false, true]);
  });

  it('when the fourth of five pins is typed for the time line two before its own, then it alone is marked at once', () => {
    // Typed 8 h for the 12 h line: 4 h off, four times the half-step limit of 60 min (pin-rms-limit.ts, common practice).
    const pins = GOOD_PINS.map((good, index) => (index === 3 ? { ...good, hours: 8 } : good));

    const check = checkPins(form, pins);

    if (check.kind !== 'fitted') throw new Error(`expected a fit, got ${check.kind}`);
    expect(check.pins[3].isOutlier).toBe(true);
    expect(Math.abs(check.pins[3].minutes)).toBeGreaterThan(60);
    expect(check.pins.map((pinCheck) => pinCheck.isOutlier)).toEqual([false, false, false, true, false]);
  });

  it('when a pin is placed a little off its crossing, then its residual shows in hPa and minutes without a mark', () => {
    // 0.3 mm off in both directions: 0.33 hPa and 11 min, inside half a grid step (1 hPa, 2 h lines).
    const nudged = { ...pin(84, 1000), xPx: toPixel({ hours: 84, pressure: 1000 }).xPx + 0.3 * PX_PER_MM, yPx: toPixel({ hours: 84, pressure: 1000 }).yPx - 0.3 * PX_PER_MM };
    const pins = [...GOOD_PINS.slice(0, 4), nudged];

    const check = checkPins(form, pins);

    if (check.kind !== 'fitted') throw new Error(`expected a fit, got ${check.kind}`);
    expect(check.pins[4].pressureHpa).toBeGreaterThan(0.05);
    expect(Math.abs(check.pins[4].minutes)).toBeGreaterThan(1);
    expect(check.pins.some((pinCheck) => pinCheck.isOutlier)).toBe(false);
  });

  it('when two pins sit at one place with different readings, then the check says why instead of drawing a grid', () => {
    const pins = [pin(12, 1040), pin(156, 1040), { ...pin(12, 1040), pressure: 1020 }];

    const check = checkPins(form, pins);

    expect(check).toEqual({ kind: 'problem', message: expect.stringContaining('same place') });
  });
});
