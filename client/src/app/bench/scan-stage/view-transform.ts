/** How the stage shows the preview: screen px per preview px, and the screen position of preview pixel (0, 0). */
export interface ViewTransform {
  scale: number;
  x: number;
  y: number;
}

export interface Size {
  width: number;
  height: number;
}

export const MIN_SCALE = 0.05;
export const MAX_SCALE = 16;

/** Scales the view by factor while keeping the content under screenPoint where it is. */
export function zoomAbout(view: ViewTransform, screenPoint: { x: number; y: number }, factor: number): ViewTransform {
  const scale = Math.min(MAX_SCALE, Math.max(MIN_SCALE, view.scale * factor));
  const contentX = (screenPoint.x - view.x) / view.scale;
  const contentY = (screenPoint.y - view.y) / view.scale;
  return { scale, x: screenPoint.x - contentX * scale, y: screenPoint.y - contentY * scale };
}

/** The whole image inside the host, centred, with a small margin. */
export function fitView(image: Size, host: Size, marginPx = 8): ViewTransform {
  const usableWidth = Math.max(host.width - 2 * marginPx, 1);
  const usableHeight = Math.max(host.height - 2 * marginPx, 1);
  const scale = Math.min(usableWidth / image.width, usableHeight / image.height);
  return { scale, x: (host.width - image.width * scale) / 2, y: (host.height - image.height * scale) / 2 };
}
