import type { Page } from 'playwright-core';

/** Where the Bench's scan stage shows the scan: its box on screen and the view's offset and scale (its data attributes). */
export interface StageView {
  left: number;
  top: number;
  scale: number;
  x: number;
  y: number;
}

export async function readStageView(page: Page): Promise<StageView> {
  const stage = page.getByTestId('scan-stage');
  const box = await stage.boundingBox();
  if (!box) throw new Error('scan-stage is not visible');
  const read = async (name: string) => Number(await stage.getAttribute(name));
  return { left: box.x, top: box.y, scale: await read('data-view-scale'), x: await read('data-view-x'), y: await read('data-view-y') };
}

/** The screen point of a scan pixel in that view. */
export function toScreen(view: StageView, point: { xPx: number; yPx: number }): { x: number; y: number } {
  return { x: view.left + view.x + point.xPx * view.scale, y: view.top + view.y + point.yPx * view.scale };
}
