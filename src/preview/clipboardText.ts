/**
 * Cells as the system clipboard carries them between spreadsheets: tab-separated text, one line a row; a cell holding
 * a tab, a line break or a double quote is quoted, its quotes doubled (common practice).
 */

/** Rows of cell texts → tab-separated text. */
export function toTabText(rows: readonly (readonly string[])[]): string {
  const cell = (t: string) => (/[\t\r\n"]/.test(t) ? `"${t.replace(/"/g, '""')}"` : t);
  return rows.map((r) => r.map(cell).join("\t")).join("\r\n");
}

/** Tab-separated text → rows of cell texts (a last line break ends the last row; it adds none). */
export function fromTabText(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = "";
  let i = 0;
  const atCellStart = () => cell === "";
  while (i < text.length) {
    const ch = text[i];
    if (ch === '"' && atCellStart()) {
      // a quoted cell: up to the closing quote; "" inside is one quote
      let j = i + 1;
      let body = "";
      let closed = false;
      while (j < text.length) {
        if (text[j] === '"') {
          if (text[j + 1] === '"') {
            body += '"';
            j += 2;
            continue;
          }
          closed = true;
          j++;
          break;
        }
        body += text[j++];
      }
      if (closed && (j >= text.length || /[\t\r\n]/.test(text[j]))) {
        cell = body;
        i = j;
        continue;
      }
      // not a quoted cell after all: the quote is text
    }
    if (ch === "\t") {
      row.push(cell);
      cell = "";
    } else if (ch === "\r" || ch === "\n") {
      row.push(cell);
      rows.push(row);
      row = [];
      cell = "";
      if (ch === "\r" && text[i + 1] === "\n") i++;
    } else {
      cell += ch;
    }
    i++;
  }
  if (cell !== "" || row.length) {
    row.push(cell);
    rows.push(row);
  }
  return rows;
}
