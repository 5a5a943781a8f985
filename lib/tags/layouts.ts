// Label layouts are rows of `label_layouts` (seeded by the migration); this is their shape and the
// grid arithmetic. Pure: no I/O. Lengths in millimetres, measured from the page's top-left corner.

export interface LabelLayout {
  id: string;
  name: string;
  description: string | null;
  pageWidthMm: number;
  pageHeightMm: number;
  labelWidthMm: number;
  labelHeightMm: number;
  columns: number;
  rows: number;
  marginLeftMm: number;
  marginTopMm: number;
  pitchXMm: number;
  pitchYMm: number;
  paddingMm: number;
}

export const MM_PER_PT = 25.4 / 72;
export const mmToPt = (mm: number): number => (mm * 72) / 25.4;
export const ptToMm = (pt: number): number => (pt * 25.4) / 72;

export function labelsPerPage(layout: LabelLayout): number {
  return layout.columns * layout.rows;
}

/** A label box on a page: x from the left edge, y from the top edge (as a ruler on paper reads). */
export interface LabelBox {
  page: number;
  /** 1-based position on its page, left to right, then top to bottom. */
  position: number;
  xMm: number;
  yMm: number;
  widthMm: number;
  heightMm: number;
}

/** Box of the label at a 1-based position on a page. */
export function boxAt(layout: LabelLayout, page: number, position: number): LabelBox {
  const i = position - 1;
  const col = i % layout.columns;
  const row = Math.floor(i / layout.columns);
  return {
    page,
    position,
    xMm: layout.marginLeftMm + col * layout.pitchXMm,
    yMm: layout.marginTopMm + row * layout.pitchYMm,
    widthMm: layout.labelWidthMm,
    heightMm: layout.labelHeightMm,
  };
}

/**
 * Where `count` labels go when printing starts at `startPosition` on the first sheet (so a partly
 * used sheet can go through the printer again); later sheets start at position 1.
 */
export function placeLabels(layout: LabelLayout, count: number, startPosition = 1): LabelBox[] {
  const perPage = labelsPerPage(layout);
  const start = Math.min(Math.max(1, Math.floor(startPosition)), perPage);
  const boxes: LabelBox[] = [];
  for (let n = 0; n < count; n++) {
    const slot = start - 1 + n;
    boxes.push(boxAt(layout, Math.floor(slot / perPage), (slot % perPage) + 1));
  }
  return boxes;
}

export function pageCount(layout: LabelLayout, count: number, startPosition = 1): number {
  if (count === 0) return 0;
  return Math.floor((Math.max(1, startPosition) - 1 + count - 1) / labelsPerPage(layout)) + 1;
}
