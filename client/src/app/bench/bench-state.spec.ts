import { TestBed } from '@angular/core/testing';

import type { FollowInkResult } from '@shared/api/follow-ink';

import { BenchState } from './bench-state';

const FOLLOWED: FollowInkResult = {
  knots: [
    { xPx: 100, yPx: 50, confidence: 0.9 },
    { xPx: 110, yPx: 52, confidence: 0.2 },
    { xPx: 140, yPx: 55, confidence: 0.8 },
    { xPx: 150, yPx: 56, confidence: 0.95 },
  ],
  spans: [{ kind: 'gap', fromIndex: 1, toIndex: 2 }],
  lineWidthPx: 4,
  elapsedMs: 120,
  inkModel: 'colour',
  inkModelReason: 'colour scan',
  coverage: 1,
  problem: null,
};

describe('BenchState', () => {
  let state: BenchState;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [BenchState] });
    state = TestBed.inject(BenchState);
  });

  it('when the preview is a third of the scan width, then a click is stored at three times its preview position', () => {
    state.setPreviewWidth(7200, 2400);

    state.chooseStep('ink');
    state.pickPoint({ x: 100, y: 50.5 });

    expect(state.knots()).toEqual([{ xPx: 300, yPx: 151.5 }]);
  });

  it('when the preview is the full scan, then clicks keep their pixel position', () => {
    state.setPreviewWidth(1800, 1800);

    const point = state.toScanPoint({ x: 12.25, y: 640 });

    expect(point).toEqual({ xPx: 12.25, yPx: 640 });
  });

  it('when the preview size is not known yet, then converting a click refuses rather than guessing', () => {
    const convert = () => state.toScanPoint({ x: 1, y: 1 });

    expect(convert).toThrow('preview size');
  });

  it('when a crossing is picked in the Pin step and saved, then it becomes a pin in scan pixels with its time and pressure', () => {
    state.setPreviewWidth(4000, 2000);

    state.pickPoint({ x: 10, y: 20 });
    const pendingBeforeSave = state.pendingPin();
    state.savePin('2026-03-03T12:00:00.000Z', 1012);

    expect(pendingBeforeSave).toEqual({ xPx: 20, yPx: 40 });
    expect(state.pins()).toEqual([{ xPx: 20, yPx: 40, time: '2026-03-03T12:00:00.000Z', pressure: 1012 }]);
    expect(state.pendingPin()).toBeNull();
    expect(state.knotCount()).toBe(0);
  });

  it('when a pin is deleted, then the others keep their order', () => {
    state.setPreviewWidth(1000, 1000);
    for (const [x, pressure] of [[1, 990], [2, 1000], [3, 1010]] as const) {
      state.pickPoint({ x, y: 0 });
      state.savePin('2026-03-03T00:00:00.000Z', pressure);
    }

    state.deletePin(1);

    expect(state.pins().map((pin) => pin.pressure)).toEqual([990, 1010]);
  });

  it('when the last knot is undone, then only that knot goes', () => {
    state.setPreviewWidth(1000, 1000);
    state.chooseStep('ink');
    state.pickPoint({ x: 1, y: 1 });
    state.pickPoint({ x: 2, y: 2 });

    state.undo();

    expect(state.knots()).toEqual([{ xPx: 1, yPx: 1 }]);
    expect(state.knotCount()).toBe(1);
  });

  it('when saving a pin without a picked crossing, then it refuses', () => {
    const save = () => state.savePin('2026-03-03T00:00:00.000Z', 1000);

    expect(save).toThrow('grid crossing');
  });

  it('when the step changes, then a half-entered crossing is dropped', () => {
    state.setPreviewWidth(1000, 1000);
    state.pickPoint({ x: 5, y: 5 });

    state.chooseStep('ink');

    expect(state.pendingPin()).toBeNull();
    expect(state.step()).toBe('ink');
  });

  it('when pins and knots are placed, then the work holds both in scan pixels, with the step', () => {
    state.setPreviewWidth(2000, 1000);
    state.pickPoint({ x: 1, y: 2 });
    state.savePin('2026-03-02T00:00:00.000Z', 29.92);
    state.chooseStep('ink');
    state.pickPoint({ x: 3, y: 4 });

    const work = state.work();

    expect(work).toEqual({
      step: 'ink',
      pins: [{ xPx: 2, yPx: 4, time: '2026-03-02T00:00:00.000Z', pressure: 29.92 }],
      knots: [{ xPx: 6, yPx: 8 }],
      timeMarks: [],
      chartOn: null,
      chartOff: null,
      checkReadings: [],
    });
  });

  it('when Follow ink answers, then its knots replace the hand-placed ones and one undo brings those back', () => {
    state.setPreviewWidth(1000, 1000);
    state.chooseStep('ink');
    state.pickPoint({ x: 5, y: 6 });
    state.pickPoint({ x: 7, y: 8 });

    state.replaceWithFollowed(FOLLOWED);
    const followed = state.knots();
    state.undo();

    expect(followed.map((knot) => [knot.xPx, knot.yPx, knot.confidence])).toEqual(FOLLOWED.knots.map((knot) => [knot.xPx, knot.yPx, knot.confidence]));
    expect(followed.map((knot) => knot.gapAfter)).toEqual([false, true, false, false]);
    expect(state.knots()).toEqual([{ xPx: 5, yPx: 6 }, { xPx: 7, yPx: 8 }]);
    expect(state.canUndo()).toBe(true);
  });

  it('when a followed knot is dragged, then it moves to the drop point in scan pixels and loses the finder confidence', () => {
    state.setPreviewWidth(2000, 1000);
    state.replaceWithFollowed(FOLLOWED);

    state.moveKnot(1, { x: 55, y: 30 });

    expect(state.knots()[1]).toEqual({ xPx: 110, yPx: 60, gapAfter: true });
    expect(state.knots()[0]).toEqual({ xPx: 100, yPx: 50, confidence: 0.9, gapAfter: false });
    expect(state.knotCount()).toBe(4);
  });

  it('when a drag is undone, then the knot is back where Follow ink put it', () => {
    state.setPreviewWidth(1000, 1000);
    state.replaceWithFollowed(FOLLOWED);
    const followed = state.knots();

    state.moveKnot(0, { x: 1, y: 1 });
    state.undo();

    expect(state.knots()).toEqual(followed);
  });

  it('when the knot before a gap is deleted, then the gap passes to the knot before it', () => {
    state.replaceWithFollowed(FOLLOWED);

    state.deleteKnot(1);

    expect(state.knots().map((knot) => knot.xPx)).toEqual([100, 140, 150]);
    expect(state.knots().map((knot) => knot.gapAfter)).toEqual([true, false, false]);
  });

  it('when a knot is clicked between followed knots, then it goes in its place along time and bridges the gap there', () => {
    state.setPreviewWidth(1000, 1000);
    state.chooseStep('ink');
    state.replaceWithFollowed(FOLLOWED);

    state.pickPoint({ x: 125, y: 54 });

    expect(state.knots().map((knot) => knot.xPx)).toEqual([100, 110, 125, 140, 150]);
    expect(state.knots()[1].gapAfter).toBe(false);
    expect(state.work().knots[2]).toEqual({ xPx: 125, yPx: 54 });
  });

  it('when a followed line is undone and redone, then Redo brings the followed knots back and a new knot ends Redo', () => {
    state.setPreviewWidth(1000, 1000);
    state.chooseStep('ink');
    state.replaceWithFollowed(FOLLOWED);

    state.undo();
    const afterUndo = state.knots();
    state.redo();
    const afterRedo = state.knots();
    state.pickPoint({ x: 200, y: 60 });

    expect(afterUndo).toEqual([]);
    expect(afterRedo).toHaveLength(4);
    expect(state.canRedo()).toBe(false);
    expect(state.knots()).toHaveLength(5);
  });

  it('when the Lift tool picks two knots, then the stretch between is a gap, and Undo takes the lift back', () => {
    state.setPreviewWidth(1000, 1000);
    state.chooseStep('ink');
    state.replaceWithFollowed({ ...FOLLOWED, spans: [] });
    state.chooseInkTool('lift');

    state.pickPoint({ x: 101, y: 50 });
    const startAfterFirstClick = state.stretchStart();
    state.pickPoint({ x: 149, y: 57 });
    const lifted = state.knots();
    state.undo();

    expect(startAfterFirstClick).toBe(0);
    expect(lifted).toEqual([{ xPx: 100, yPx: 50, confidence: 0.9, gapAfter: true }, { xPx: 150, yPx: 56, confidence: 0.95, gapAfter: false }]);
    expect(state.stretchStart()).toBeNull();
    expect(state.knots()).toHaveLength(4);
  });

  it('when the Bridge tool picks the knots either side of a gap, then the gap becomes a bridge and no knot is added', () => {
    state.setPreviewWidth(1000, 1000);
    state.chooseStep('ink');
    state.replaceWithFollowed(FOLLOWED);
    state.chooseInkTool('bridge');

    state.pickPoint({ x: 140, y: 55 });
    state.pickPoint({ x: 110, y: 52 });

    expect(state.knots().map((knot) => [knot.gapAfter ?? false, knot.bridgeAfter ?? false])).toEqual([
      [false, false],
      [false, true],
      [false, false],
      [false, false],
    ]);
    expect(state.work().knots[1].bridgeAfter).toBe(true);
  });

  it('when a crossing is picked snapped, then the snap distance is kept in scan pixels; a later plain pick clears it', () => {
    state.setPreviewWidth(3000, 1500);

    state.pickPoint({ x: 10, y: 20 }, 0.8);
    const snappedPx = state.pendingSnapPx();
    state.pickPoint({ x: 12, y: 20 });

    expect(snappedPx).toBeCloseTo(1.6, 6);
    expect(state.pendingSnapPx()).toBeNull();
  });

  it('when nothing has changed, then undo does nothing', () => {
    state.undo();

    expect(state.knots()).toEqual([]);
    expect(state.canUndo()).toBe(false);
  });

  it('when saved work is loaded, then the Bench shows it exactly as left and Undo starts afresh', () => {
    state.replaceWithFollowed(FOLLOWED);
    const work = {
      step: 'marks' as const,
      pins: [{ xPx: 2, yPx: 4, time: '2026-03-02T00:00:00.000Z', pressure: 1000 }],
      knots: [{ xPx: 1, yPx: 2, confidence: 0.3, gapAfter: true }, { xPx: 3, yPx: 4, bridgeAfter: true }, { xPx: 5, yPx: 6 }],
      timeMarks: [{ xPx: 3, yPx: 4, time: null }],
      chartOn: '2026-03-02T01:00:00.000Z',
      chartOff: null,
      checkReadings: [{ time: '2026-03-02T08:00:00.000Z', pressureHpa: 1001.2 }],
    };

    state.loadWork(work);

    expect(state.work()).toEqual(work);
    expect(state.canUndo()).toBe(false);
  });

  it('when the Marks step is clicked, then a time mark is added at the click in scan pixels, in order along the chart', () => {
    state.setPreviewWidth(2000, 1000);
    state.chooseStep('marks');

    state.pickPoint({ x: 50, y: 10 });
    state.pickPoint({ x: 20, y: 12 });
    state.setTimeMarkTime(1, '2026-03-02T08:00:00.000Z');

    expect(state.timeMarks()).toEqual([
      { xPx: 40, yPx: 24, time: null },
      { xPx: 100, yPx: 20, time: '2026-03-02T08:00:00.000Z' },
    ]);
    expect(state.knots()).toEqual([]);
  });
});
