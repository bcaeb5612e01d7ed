// The printout as data: each sheet is a display list in millimetres (origin top left, y down).
// The same list becomes an SVG (sheetToSvg), a PDF page (app/report/pdf.ts) or a printed page.

export type FontWeight = 'regular' | 'bold';
export type Anchor = 'start' | 'middle' | 'end';

export interface Stroke {
  /** Line width, mm. */
  width: number;
  /** CSS hex colour, `#rrggbb`. */
  color: string;
  /** Dash pattern, mm on / mm off. */
  dash?: [number, number];
}

export interface LineItem {
  kind: 'line';
  x1: number;
  y1: number;
  x2: number;
  y2: number;
  stroke: Stroke;
}

export interface RectItem {
  kind: 'rect';
  x: number;
  y: number;
  w: number;
  h: number;
  stroke?: Stroke;
  fill?: string;
}

export interface PolylineItem {
  kind: 'polyline';
  points: Array<[number, number]>;
  /** Closed polylines are polygons and may be filled. */
  closed?: boolean;
  stroke?: Stroke;
  fill?: string;
}

export interface CircleItem {
  kind: 'circle';
  cx: number;
  cy: number;
  r: number;
  stroke?: Stroke;
  fill?: string;
}

export interface TextItem {
  kind: 'text';
  /** Anchor point; y is the baseline. */
  x: number;
  y: number;
  text: string;
  /** Font size (em height), mm. Never under MIN_TEXT_MM. */
  size: number;
  font: FontWeight;
  anchor: Anchor;
  color?: string;
}

export type Item = LineItem | RectItem | PolylineItem | CircleItem | TextItem;

export type SheetKind = 'diagram' | 'schedule' | 'assumptions' | 'test';

export interface Sheet {
  widthMm: number;
  heightMm: number;
  kind: SheetKind;
  /** What the sheet shows, e.g. "Diagram (part 2 of 3)"; also printed in the title block. */
  title: string;
  items: Item[];
}

export interface ReportOptions {
  paper?: 'A3' | 'A4';
  orientation?: 'landscape' | 'portrait';
  /**
   * The test sheets, one per board, for verification on site (each circuit's test limit, the
   * readings and their results, or blank cells for them): `'only'` the test sheets alone,
   * `'include'` after the rest of the printout; absent, none.
   */
  testSheet?: 'only' | 'include';
}

/** The smallest text on paper, mm. */
export const MIN_TEXT_MM = 2;
/** The family every text item is set in (embedded in the PDF, named in the SVG). */
export const FONT_FAMILY = 'DejaVu Sans';
