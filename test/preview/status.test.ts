// @vitest-environment happy-dom
/**
 * The preview's status line never stays red over a workbook that is fine, and the sample menu never names a sample
 * the grid does not show.
 */
import { describe, expect, it } from "vitest";
import { StatusLine, showInPicker } from "../../src/preview/status";

function line(): { status: StatusLine; el: HTMLElement } {
  const el = document.createElement("span");
  return { status: new StatusLine(el), el };
}

describe("the status line", () => {
  it("clears an error at a change once its check says it no longer holds, and keeps it while it does", async () => {
    const { status, el } = line();
    let demoCells = 2;
    const reason = () => `No share copy made: ${demoCells} cells still hold demo values.`;
    status.error(reason(), () => (demoCells > 0 ? reason() : null));
    expect(el.classList.contains("is-error")).toBe(true);
    demoCells = 1;
    await status.changed();
    // still holds: red, saying what holds now
    expect(status.state).toEqual({ text: "No share copy made: 1 cells still hold demo values.", error: true });
    demoCells = 0;
    await status.changed();
    expect(status.state).toEqual({ text: "", error: false });
    expect(el.classList.contains("is-error")).toBe(false);
  });

  it("clears an error of an action (no check) at the next change", async () => {
    const { status } = line();
    status.error("Could not open broken.xlsx: the file holds no worksheet");
    await status.changed();
    expect(status.state).toEqual({ text: "", error: false });
  });

  it("leaves plain messages alone at a change", async () => {
    const { status } = line();
    status.show("Saved estimate.xlsx with formulas and their values.");
    await status.changed();
    expect(status.state).toEqual({ text: "Saved estimate.xlsx with formulas and their values.", error: false });
  });

  it("never lets a check that finishes late undo a newer message", async () => {
    const { status } = line();
    let finish: (v: string | null) => void = () => {};
    status.error("No summary yet: fix the inputs the pane lists first, then try again.", () => new Promise((r) => (finish = r)));
    const checking = status.changed();
    status.show("Saved estimate.xlsx with formulas and their values.");
    finish(null);
    await checking;
    expect(status.state).toEqual({ text: "Saved estimate.xlsx with formulas and their values.", error: false });
  });
});

describe("the sample menu", () => {
  function picker(): HTMLSelectElement {
    const select = document.createElement("select");
    for (const [file, title] of [
      ["a.xlsx", "Sample A"],
      ["b.xlsx", "Sample B"],
    ]) {
      const o = document.createElement("option");
      o.value = file;
      o.textContent = title;
      select.append(o);
    }
    document.body.append(select);
    return select;
  }
  const shown = (p: HTMLSelectElement) => p.options[p.selectedIndex]?.textContent;

  it("names the sample open; for anything else, the file's own name, selected and not choosable", () => {
    const p = picker();
    showInPicker(p, "b.xlsx", "b.xlsx");
    expect(shown(p)).toBe("Sample B");
    showInPicker(p, null, "my estimate.xlsx");
    expect(shown(p)).toBe("Your file: my estimate.xlsx");
    expect(p.options[0].disabled).toBe(true);
    expect(p.options).toHaveLength(3);
    // saved again under another name: one option of its own, renamed
    showInPicker(p, null, "other.xlsx");
    expect(shown(p)).toBe("Your file: other.xlsx");
    expect(p.options).toHaveLength(3);
    // a sample opened again: its title, and the file's own option gone
    showInPicker(p, "a.xlsx", "a.xlsx");
    expect(shown(p)).toBe("Sample A");
    expect([...p.options].map((o) => o.value)).toEqual(["a.xlsx", "b.xlsx"]);
  });

  it("treats a sample it does not list (kept work of a sample since removed) as a file of its own", () => {
    const p = picker();
    showInPicker(p, "gone.xlsx", "gone.xlsx");
    expect(shown(p)).toBe("Your file: gone.xlsx");
  });
});
