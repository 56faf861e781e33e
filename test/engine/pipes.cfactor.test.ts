import { describe, expect, it } from "vitest";
import { MATERIAL_CODES, cFactorRow, hazenWilliamsC } from "../../src/engine/cfactor";

describe("Hazen-Williams C table", () => {
  it("has the vocabulary's twelve materials", () => {
    expect(MATERIAL_CODES).toEqual([
      "steel", "galvanized", "plastic", "cpvc", "copper", "stainless", "brass",
      "ductile", "cast", "lined ductile", "asbestos cement", "concrete",
    ]);
  });

  it("gives wet and dry C for each material", () => {
    const expected: [string, number, number][] = [
      ["steel", 120, 100], // [NFPA 13] black steel
      ["galvanized", 120, 100], // [NFPA 13] galvanized steel
      ["plastic", 150, 150], // [NFPA 13] plastic (listed), all
      ["cpvc", 150, 150], // [NFPA 13] plastic (listed), all
      ["copper", 150, 150], // [NFPA 13] copper tube, brass or stainless steel
      ["stainless", 150, 150], // [NFPA 13] copper tube, brass or stainless steel
      ["brass", 150, 150], // [NFPA 13] copper tube, brass or stainless steel
      ["ductile", 100, 100], // [NFPA 13] unlined cast or ductile iron
      ["cast", 100, 100], // [NFPA 13] unlined cast or ductile iron
      ["lined ductile", 140, 140], // [NFPA 13] cement-lined cast or ductile iron
      ["asbestos cement", 140, 140], // [NFPA 13] asbestos cement
      ["concrete", 140, 140], // [NFPA 13] concrete
    ];
    for (const [m, wet, dry] of expected) {
      expect(hazenWilliamsC(m as never, "wet"), `${m} wet`).toBe(wet);
      expect(hazenWilliamsC(m as never, "dry"), `${m} dry`).toBe(dry);
    }
    expect(hazenWilliamsC("steel")).toBe(120); // default system wet [NFPA 13]
  });

  it("names the table row each material reads", () => {
    expect(cFactorRow("ductile").description).toBe("unlined cast or ductile iron");
    expect(cFactorRow("lined ductile").description).toBe("cement-lined cast or ductile iron");
    expect(cFactorRow("brass").description).toBe("copper tube, brass or stainless steel");
  });

  it("refuses unknown materials and systems with the accepted list", () => {
    expect(() => hazenWilliamsC("wood" as never)).toThrow(/material: got "wood"; must be one of "steel", "galvanized"/);
    expect(() => hazenWilliamsC("steel", "damp" as never)).toThrow('system: got "damp"; must be "wet" or "dry"');
  });
});
