/**
 * The name Save gives a file from what the user typed (src/preview/keep.ts). The characters left out are those
 * Windows refuses in a file name, \ / : * ? " < > | and control characters (common practice).
 */
import { describe, expect, test } from "vitest";
import { cleanFileName } from "../../src/preview/keep";

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
