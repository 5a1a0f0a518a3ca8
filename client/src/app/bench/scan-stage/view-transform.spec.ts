import { fitView, MAX_SCALE, zoomAbout } from './view-transform';

describe('zoomAbout', () => {
  it('when zooming about a screen point, then the content under that point stays under it', () => {
    const view = { scale: 0.5, x: 10, y: 20 };
    const cursor = { x: 210, y: 120 };
    const contentBefore = { x: (cursor.x - view.x) / view.scale, y: (cursor.y - view.y) / view.scale };

    const zoomed = zoomAbout(view, cursor, 2);

    expect(zoomed.scale).toBe(1);
    expect((cursor.x - zoomed.x) / zoomed.scale).toBeCloseTo(contentBefore.x, 9);
    expect((cursor.y - zoomed.y) / zoomed.scale).toBeCloseTo(contentBefore.y, 9);
  });

  it('when zooming past the largest scale, then the scale stops there', () => {
    const zoomed = zoomAbout({ scale: MAX_SCALE, x: 0, y: 0 }, { x: 0, y: 0 }, 4);

    expect(zoomed.scale).toBe(MAX_SCALE);
  });
});

describe('fitView', () => {
  it('when the image is wider than the host, then it fits the width and is centred vertically', () => {
    const view = fitView({ width: 2400, height: 600 }, { width: 1216, height: 800 }, 8);

    expect(view.scale).toBeCloseTo(0.5, 9);
    expect(view.x).toBeCloseTo(8, 9);
    expect(view.y).toBeCloseTo(250, 9);
  });
});
