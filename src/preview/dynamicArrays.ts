/**
 * Spills stored the way current Excel stores a dynamic array, in a file ExcelJS wrote (ExcelJS writes array formulas
 * but neither the cell attribute nor the part that make them dynamic): each array formula's top-left cell gets
 * `cm="1"`, and the workbook gets the cell-metadata part it points at (xl/metadata.xml), declared in
 * [Content_Types].xml and related from the workbook.
 *
 * The part holds one metadata type, XLDAPR, whose future-metadata block carries the dynamic-array properties
 * `<xda:dynamicArrayProperties fDynamic="1" fCollapsed="0"/>` in the 2017 dynamic-array namespace, under the extension
 * uri {bdbb8cdc-fa1e-496e-a857-3c3f30c029c3}; one cell-metadata block points at it, and `cm="1"` (the first block)
 * marks a cell with it. Sources: the schema of that namespace ([MS-XLSX], "dynamicarray" schema,
 * https://learn.microsoft.com/openspecs/office_standards/ms-xlsx/878c8ac4-8548-4bfb-9ad4-b1378e0efed1); its binary twin
 * BrtBeginDynamicArrayPr, "fDynamic: a Boolean indicating the presence of a dynamic array; fCollapsed: MUST be 0"
 * ([MS-XLSB] §2.4.413, https://learn.microsoft.com/openspecs/office_file_formats/ms-xlsb/6107bca7-c00a-474e-9dff-3551f52df7de);
 * the cell's `cm` attribute (ECMA-376 Part 1, §18.3.1.4 c) and the metadata part it indexes; and how Excel
 * itself saves a dynamic array, as taken apart in LibreOffice's bug 127808, comment 2
 * (https://bugs.documentfoundation.org/show_bug.cgi?id=127808): the formula in the block's top-left cell as
 * `<f t="array" ref="…">`, that cell with `cm="1"`, the other cells of the block holding their values.
 *
 * The calculation properties keep no calculation-engine id (`calcId`): Excel takes a missing one as 0 ([MS-OI29500]
 * §2.1.565 c, https://learn.microsoft.com/openspecs/office_standards/ms-oi29500/9a86ba92-3c7d-4538-a7ae-4c262aab614d),
 * and "when you open a workbook that was created in an earlier version of the application, all the formulas in the
 * workbook … are recalculated" (ECMA-376 Part 1, §18.2.2 calcPr, calcId). So Excel computes every formula when it
 * opens the file, without the file forcing a full calculation on every reader (no `fullCalcOnLoad`).
 */
import type JSZipType from "jszip";

type JSZipClass = typeof JSZipType;

let loading: Promise<JSZipClass> | undefined;

/** JSZip, loaded on first use (with ExcelJS, when a file is saved). */
async function zipLibrary(): Promise<JSZipClass> {
  loading ??= import("jszip").then((m) => ((m as unknown as { default?: JSZipClass }).default ?? m) as JSZipClass);
  return loading;
}

/** The extension uri under which Excel keeps the dynamic-array properties. */
export const DYNAMIC_ARRAY_EXT_URI = "{bdbb8cdc-fa1e-496e-a857-3c3f30c029c3}";
export const DYNAMIC_ARRAY_NS = "http://schemas.microsoft.com/office/spreadsheetml/2017/dynamicarray";
const MAIN_NS = "http://schemas.openxmlformats.org/spreadsheetml/2006/main";
const METADATA_PART = "xl/metadata.xml";
const METADATA_TYPE = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheetMetadata+xml";
const METADATA_REL = "http://schemas.openxmlformats.org/officeDocument/2006/relationships/sheetMetadata";

/** The cell-metadata part: one type (XLDAPR), one dynamic-array record, one cell block pointing at it. */
export const METADATA_XML =
  `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n` +
  `<metadata xmlns="${MAIN_NS}" xmlns:xda="${DYNAMIC_ARRAY_NS}">` +
  `<metadataTypes count="1"><metadataType name="XLDAPR" minSupportedVersion="120000" copy="1" pasteAll="1" pasteValues="1" ` +
  `merge="1" splitFirst="1" rowColShift="1" clearFormats="1" clearComments="1" assign="1" coerce="1" cellMeta="1"/></metadataTypes>` +
  `<futureMetadata name="XLDAPR" count="1"><bk><extLst><ext uri="${DYNAMIC_ARRAY_EXT_URI}">` +
  `<xda:dynamicArrayProperties fDynamic="1" fCollapsed="0"/></ext></extLst></bk></futureMetadata>` +
  `<cellMetadata count="1"><bk><rc t="1" v="0"/></bk></cellMetadata>` +
  `</metadata>`;

/**
 * A worksheet's XML with every array formula's cell marked as a dynamic array (`cm="1"`); returns the XML and how many
 * cells were marked. ExcelJS writes a formula as the cell's first child: `<c r="B55" s="11"><f t="array" ref="B55:F55">`.
 */
export function markArrayCells(xml: string): { xml: string; marked: number } {
  let marked = 0;
  const out = xml.replace(/<c( [^>]*)>(?=<f t="array")/g, (whole, attrs: string) => {
    if (/ cm="/.test(attrs)) return whole;
    marked++;
    return `<c${attrs} cm="1">`;
  });
  return { xml: out, marked };
}

/**
 * The file ExcelJS wrote, with its spills as dynamic arrays and no calculation-engine id. A file without an array
 * formula gets no metadata part. Every part of the zip is dated `date` (the workbook's own date), so that the same
 * workbook saved twice gives the same bytes (ExcelJS dates the parts with the time of writing).
 */
export async function storeDynamicArrays(bytes: Uint8Array, date: Date): Promise<Uint8Array> {
  const JSZip = await zipLibrary();
  const zip = await JSZip.loadAsync(bytes);
  const read = (name: string) => zip.file(name)!.async("string");
  const write = (name: string, text: string) => zip.file(name, text, { date });
  let marked = 0;
  for (const name of Object.keys(zip.files)) {
    if (!/^xl\/worksheets\/sheet\d+\.xml$/.test(name)) continue;
    const result = markArrayCells(await read(name));
    if (result.marked) write(name, result.xml);
    marked += result.marked;
  }
  write("xl/workbook.xml", (await read("xl/workbook.xml")).replace(/(<calcPr\b[^>]*?) calcId="\d+"/, "$1"));
  if (marked) {
    write(METADATA_PART, METADATA_XML);
    const types = await read("[Content_Types].xml");
    write("[Content_Types].xml", types.replace("</Types>", `<Override PartName="/${METADATA_PART}" ContentType="${METADATA_TYPE}"/></Types>`));
    const relsName = "xl/_rels/workbook.xml.rels";
    const rels = await read(relsName);
    const ids = new Set([...rels.matchAll(/ Id="([^"]+)"/g)].map((m) => m[1]));
    let n = ids.size + 1;
    while (ids.has(`rId${n}`)) n++;
    write(relsName, rels.replace("</Relationships>", `<Relationship Id="rId${n}" Type="${METADATA_REL}" Target="metadata.xml"/></Relationships>`));
  }
  for (const entry of Object.values(zip.files)) entry.date = date;
  return zip.generateAsync({ type: "uint8array", compression: "DEFLATE" });
}
