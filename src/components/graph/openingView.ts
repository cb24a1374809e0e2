// Where the graph opens. A short stack is shown whole. A tall one would have to shrink until nothing on
// it can be read, so it opens at a readable zoom on the node an engineer looks at first — the governing
// lift, or the top of the stack when there are no results — with the view kept on the drawing.
// Drawing only; Fit still shows the whole stack at whatever zoom that takes.

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}
export interface Viewport {
  x: number;
  y: number;
  zoom: number;
}

/** Below this zoom the cards' 12-px text falls under about 10 px on screen (judged on screenshots). */
export const READABLE_ZOOM = 0.85;
/** Never larger than this when a small stack would fill the pane. */
export const OPENING_MAX_ZOOM = 1.1;
/** Screen pixels kept clear around the drawing. */
const MARGIN_PX = 24;

/** The box around all the given boxes (at least one). */
export function boundsOf(boxes: readonly Box[]): Box {
  const x = Math.min(...boxes.map((b) => b.x));
  const y = Math.min(...boxes.map((b) => b.y));
  return {
    x,
    y,
    width: Math.max(...boxes.map((b) => b.x + b.width)) - x,
    height: Math.max(...boxes.map((b) => b.y + b.height)) - y,
  };
}

const clamp = (v: number, lo: number, hi: number) => Math.min(Math.max(v, lo), hi);

/**
 * The centre (graph units) along one axis: the middle of the drawing when it fits the pane, else the
 * focus, moved only as far as needed to keep the pane on the drawing (a focus at the top of the stack
 * puts the top at the top of the pane, not in its middle).
 */
function centreOn(start: number, size: number, paneSize: number, zoom: number, focus: number): number {
  const visible = paneSize / zoom;
  const margin = MARGIN_PX / zoom;
  if (size + 2 * margin <= visible) return start + size / 2;
  return clamp(focus, start - margin + visible / 2, start + size + margin - visible / 2);
}

/**
 * The viewport (Vue Flow's: screen = graph × zoom + x/y) that shows `all` when it can be read whole,
 * else `focus` at READABLE_ZOOM.
 */
export function openingViewport(pane: { width: number; height: number }, all: Box, focus: Box): Viewport {
  const fit = Math.min((pane.width - 2 * MARGIN_PX) / all.width, (pane.height - 2 * MARGIN_PX) / all.height);
  const zoom = clamp(fit, READABLE_ZOOM, OPENING_MAX_ZOOM);
  const cx = centreOn(all.x, all.width, pane.width, zoom, focus.x + focus.width / 2);
  const cy = centreOn(all.y, all.height, pane.height, zoom, focus.y + focus.height / 2);
  return { x: pane.width / 2 - cx * zoom, y: pane.height / 2 - cy * zoom, zoom };
}
