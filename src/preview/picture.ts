/**
 * The pane's supply-versus-demand plot as a picture for a share copy file: the pane's SVG drawn on a canvas through an
 * image of its serialised markup, saved as PNG, and the place on the share copy's sheet where it goes.
 *
 * The plot's SVG draws with presentation attributes (colours, strokes, font sizes) and takes only its font family from
 * the page's style sheet; the copy that is drawn carries that family itself, since an SVG drawn as an image sees no
 * style sheet of the page.
 */
import { cellAddress, parseCell, parseRange } from "../workbook/a1";
import { SHARE_STAMP_ROWS } from "../workbook/port";
import { CHART_FROM, CHART_TO } from "../workbook/template";
import type { SheetData } from "./model";

/** A PNG picture for a sheet: its data (a data: URL), where its top-left corner goes, its size on the sheet in px. */
export interface SheetPicture {
  sheet: string;
  /** "data:image/png;base64,…" */
  png: string;
  /** the cell under the picture's top-left corner, "F7" */
  at: string;
  width: number;
  height: number;
}

/** Pixels of the PNG per pixel of the picture on the sheet: sharp when the sheet is zoomed or printed. */
export const PICTURE_SCALE = 2;

/**
 * Where the plot goes on a share copy's sheet: where the estimate sheet's chart stands (shifted down by the stamp's
 * rows) when that block is empty, else right of the sheet's last used column, below the stamp.
 */
export function picturePlace(sheet: SheetData): string {
  const block = parseRange(`${CHART_FROM}:${CHART_TO}`);
  const top = block.start.row + SHARE_STAMP_ROWS;
  const used = Object.entries(sheet.cells)
    .filter(([, c]) => c.content !== null && c.content !== "")
    .map(([a]) => parseCell(a));
  const taken = used.some(
    (a) => a.row >= top && a.row < top + block.rows && a.col >= block.start.col && a.col < block.start.col + block.cols,
  );
  if (!taken) return cellAddress({ row: top, col: block.start.col });
  const lastCol = Math.max(0, ...used.map((a) => a.col));
  return cellAddress({ row: SHARE_STAMP_ROWS, col: lastCol + 2 });
}

/**
 * The plot as PNG, `PICTURE_SCALE` times its size in the pane, on white. Resolves to null where the pane shows no
 * plot (an estimate not ready yet).
 */
export async function plotPng(svg: SVGSVGElement | null): Promise<{ png: string; width: number; height: number } | null> {
  if (!svg) return null;
  const doc = svg.ownerDocument;
  const view = doc.defaultView;
  if (!view) return null;
  const width = Number(svg.getAttribute("width")) || svg.getBoundingClientRect().width;
  const height = Number(svg.getAttribute("height")) || svg.getBoundingClientRect().height;
  const copy = svg.cloneNode(true) as SVGSVGElement;
  copy.setAttribute("font-family", view.getComputedStyle(svg).fontFamily);
  copy.setAttribute("width", String(width));
  copy.setAttribute("height", String(height));
  const markup = new view.XMLSerializer().serializeToString(copy);
  const image = new view.Image();
  const loaded = new Promise<void>((resolve, reject) => {
    image.onload = () => resolve();
    image.onerror = () => reject(new Error("the plot could not be drawn as a picture"));
  });
  image.src = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(markup)}`;
  await loaded;
  const canvas = doc.createElement("canvas");
  canvas.width = Math.round(width * PICTURE_SCALE);
  canvas.height = Math.round(height * PICTURE_SCALE);
  const g = canvas.getContext("2d");
  if (!g) throw new Error("the page cannot draw on a canvas");
  g.fillStyle = "#FFFFFF";
  g.fillRect(0, 0, canvas.width, canvas.height);
  g.drawImage(image, 0, 0, canvas.width, canvas.height);
  return { png: canvas.toDataURL("image/png"), width: Math.round(width), height: Math.round(height) };
}
