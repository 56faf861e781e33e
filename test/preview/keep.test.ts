/**
 * Keeping unsaved work in the browser (src/preview/keep.ts): whether the last write went through, and the name Save
 * gives a file from what the user typed. The characters left out are those
 * Windows refuses in a file name, \ / : * ? " < > | and control characters (common practice).
 */
import { describe, expect, test, vi } from "vitest";
import { Keeper, cleanFileName } from "../../src/preview/keep";
import { PreviewWorkbook } from "../../src/preview/workbook";

describe("the file name Save uses", () => {
  test("what the user typed, with .xlsx added where it is missing", () => {
    expect(cleanFileName("Fallow Road hall")).toBe("Fallow Road hall.xlsx");
    expect(cleanFileName("  Fallow Road hall.XLSX ")).toBe("Fallow Road hall.XLSX");
    expect(cleanFileName("Unit 4, Tinker Row (sample)")).toBe("Unit 4, Tinker Row (sample).xlsx");
  });

  test("characters no file system takes are left out; nothing left is no name", () => {
    expect(cleanFileName('a/b\\c:d*e?f"g<h>i|j')).toBe("abcdefghij.xlsx");
    expect(cleanFileName("tab\there")).toBe("tabhere.xlsx");
    expect(cleanFileName("..hidden")).toBe("hidden.xlsx");
    expect(cleanFileName("  ")).toBe("");
    expect(cleanFileName("???")).toBe("");
    expect(cleanFileName(".xlsx")).toBe("");
  });
});

describe("the keeper says whether keeping works now", () => {
  /** A browser storage with one store, whose transactions fail while `full` is true (a full or refused storage). */
  function storage() {
    const state = { full: false };
    const later = (f: () => void) => setTimeout(f, 0);
    const transaction = () => {
      const tx: { oncomplete?: () => void; onerror?: () => void; error: Error | null; objectStore(): unknown } = {
        error: null,
        objectStore: () => {
          const request = () => {
            const r = { result: undefined };
            later(() => {
              if (state.full) {
                tx.error = new Error("QuotaExceededError: the storage is full");
                tx.onerror?.();
              } else tx.oncomplete?.();
            });
            return r;
          };
          return { put: request, delete: request, get: request };
        },
      };
      return tx;
    };
    const indexedDB = {
      open: () => {
        const r: { result: unknown; onsuccess?: () => void } = { result: { transaction, createObjectStore: () => undefined } };
        later(() => r.onsuccess?.());
        return r;
      },
    };
    return { state, indexedDB };
  }

  test("failing after a write the storage refused, and no longer once a write goes through", async () => {
    const { state, indexedDB } = storage();
    vi.stubGlobal("indexedDB", indexedDB);
    try {
      const wb = new PreviewWorkbook({ sheets: [{ name: "Notes", cells: {} }], names: [] });
      const told: string[] = [];
      const keeper = new Keeper(wb, () => ({ fileName: "notes.xlsx", sample: null }), (e) => told.push(e.message));
      state.full = true;
      wb.setTyped("Notes", "A1", "1");
      await keeper.idle();
      expect(keeper.failing?.message).toBe("QuotaExceededError: the storage is full");
      expect(told).toEqual(["QuotaExceededError: the storage is full"]);
      state.full = false;
      wb.setTyped("Notes", "A1", "2");
      await keeper.idle();
      expect(keeper.failing).toBeNull();
      expect(told).toHaveLength(1);
    } finally {
      vi.unstubAllGlobals();
    }
  });
});
