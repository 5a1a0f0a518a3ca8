import { chartGrid } from './chart-grid';
import { paperFromReading } from './chart-geometry';
import { prefillPin, stepPressureLine, stepTimeLine } from './pin-prefill';
import { TEST_WEEKLY_FORM } from './testing/test-weekly-form';

const form = TEST_WEEKLY_FORM;
const DPI = 150;
const PX_PER_MM = DPI / 25.4;

/** An invented scan: the printed grid drawn at `pxPerMm`, rotated by `rotationDeg` about its corner, offset by the margins (mm). */
function scan({ leftMm = 15, bottomMm = 12, rightMm = 15, topMm = 12, rotationDeg = 0, pxPerMm = PX_PER_MM } = {}) {
  const { bounds } = chartGrid(form);
  const widthPx = Math.round((leftMm + bounds.maxUMm - bounds.minUMm + rightMm) * pxPerMm);
  const heightPx = Math.round((topMm + bounds.maxVMm - bounds.minVMm + bottomMm) * pxPerMm);
  const angle = (rotationDeg * Math.PI) / 180;
  const toPixel = (reading: { hours: number; pressure: number }) => {
    const paper = paperFromReading(form, reading);
    const u = paper.uMm - bounds.minUMm;
    const v = paper.vMm;
    const x = u * Math.cos(angle) - v * Math.sin(angle);
    const y = u * Math.sin(angle) + v * Math.cos(angle);
    return { xPx: (leftMm + x) * pxPerMm, yPx: heightPx - (bottomMm + y) * pxPerMm };
  };
  const pin = (hours: number, pressure: number) => ({ ...toPixel({ hours, pressure }), hours, pressure });
  return { widthPx, heightPx, toPixel, pin };
}

describe('prefillPin', () => {
  it('when no pin is placed and the scan gives its dpi, then the crossing is read off the grid centred on the scan', () => {
    const sheet = scan();

    const prefill = prefillPin({ form, scanWidthPx: sheet.widthPx, scanHeightPx: sheet.heightPx, dpi: DPI, pins: [], click: sheet.toPixel({ hours: 24, pressure: 1040 }) });

    expect(prefill).toEqual({ hours: 24, pressure: 1040, nearbyHours: [18, 20, 22, 24, 26, 28, 30], basis: 'scan' });
  });

  it('when no pin is placed and the dpi is unknown, then the grid is taken to fill nine tenths of the scan', () => {
    // Margins of 5 % each side of the grid's width: the share the guess assumes (common practice for chart scans).
    const { bounds } = chartGrid(form);
    const marginMm = ((bounds.maxUMm - bounds.minUMm) * 0.1) / 0.9 / 2;
    const sheet = scan({ leftMm: marginMm, rightMm: marginMm, bottomMm: 40, topMm: 40 });

    const prefill = prefillPin({ form, scanWidthPx: sheet.widthPx, scanHeightPx: sheet.heightPx, dpi: null, pins: [], click: sheet.toPixel({ hours: 120, pressure: 990 }) });

    expect(prefill.hours).toBe(120);
    expect(prefill.pressure).toBe(990);
  });

  it('when one pin is placed on an off-centre scan, then the next crossing is read from that pin and the dpi', () => {
    // 40 mm of margin on the left and 5 mm on the right: centring alone would be 17.5 mm (about 11 h) out.
    const sheet = scan({ leftMm: 40, rightMm: 5, bottomMm: 30, topMm: 4 });
    const pins = [sheet.pin(24, 1040)];

    const prefill = prefillPin({ form, scanWidthPx: sheet.widthPx, scanHeightPx: sheet.heightPx, dpi: DPI, pins, click: sheet.toPixel({ hours: 144, pressure: 960 }) });

    expect(prefill).toMatchObject({ hours: 144, pressure: 960, basis: 'pins' });
  });

  it('when two pins are placed on a scan whose dpi is wrong, then their spread gives the scale', () => {
    // The file says 150 dpi but the scan was shrunk by 8 %: a dpi-only guess would drift by ~10 h at the far end.
    const sheet = scan({ pxPerMm: PX_PER_MM * 0.92 });
    const pins = [sheet.pin(24, 1040), sheet.pin(144, 960)];

    const prefill = prefillPin({ form, scanWidthPx: sheet.widthPx, scanHeightPx: sheet.heightPx, dpi: DPI, pins, click: sheet.toPixel({ hours: 160, pressure: 1045 }) });

    expect(prefill).toMatchObject({ hours: 160, pressure: 1045, basis: 'pins' });
  });

  it('when three pins are placed on a crooked scan, then the fitted registration reads the click', () => {
    // 1.5° of rotation: 7 mm of sideways drift across the chart, more than two time lines, which no axis-aligned guess survives.
    const sheet = scan({ rotationDeg: 1.5, bottomMm: 20, topMm: 20 });
    const pins = [sheet.pin(24, 1040), sheet.pin(144, 1040), sheet.pin(144, 960)];

    const prefill = prefillPin({ form, scanWidthPx: sheet.widthPx, scanHeightPx: sheet.heightPx, dpi: DPI, pins, click: sheet.toPixel({ hours: 24, pressure: 960 }) });

    expect(prefill).toMatchObject({ hours: 24, pressure: 960, basis: 'registration' });
  });

  it('when the click is a little off the crossing, then the nearest printed lines are offered', () => {
    const sheet = scan();
    const near = sheet.toPixel({ hours: 50.6, pressure: 1012.3 });

    const prefill = prefillPin({ form, scanWidthPx: sheet.widthPx, scanHeightPx: sheet.heightPx, dpi: DPI, pins: [], click: near });

    expect(prefill.hours).toBe(50);
    expect(prefill.pressure).toBe(1012);
  });

  it('when the click is beyond the last time line, then the guess is the last line and the list stays on the chart', () => {
    const sheet = scan({ rightMm: 40 });
    const beyond = sheet.toPixel({ hours: 175, pressure: 1055 });

    const prefill = prefillPin({ form, scanWidthPx: sheet.widthPx, scanHeightPx: sheet.heightPx, dpi: DPI, pins: [sheet.pin(24, 1040)], click: beyond });

    expect(prefill.hours).toBe(168);
    expect(prefill.pressure).toBe(1050);
    expect(prefill.nearbyHours).toEqual([162, 164, 166, 168]);
  });
});

describe('stepTimeLine and stepPressureLine', () => {
  it.each([
    ['one line later', 24, 1, 26],
    ['two lines earlier', 24, -2, 20],
    ['from between two lines', 25.1, 1, 28],
    ['past the chart start', 2, -3, 0],
    ['past the drum turn', 166, 4, 168],
  ])('when the time steps %s, then it lands on a printed time line', (_case, hours, steps, expected) => {
    expect(stepTimeLine(form, hours, steps)).toBe(expected);
  });

  it.each([
    ['one line up', 1012, 1, 1013],
    ['ten lines down', 1012, -10, 1002],
    ['past the top', 1049, 5, 1050],
  ])('when the pressure steps %s, then it lands on a printed pressure line', (_case, pressure, steps, expected) => {
    expect(stepPressureLine(form, pressure, steps)).toBe(expected);
  });
});
