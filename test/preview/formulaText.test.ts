/**
 * Formula text between files and the engine: how Excel spells an add-in's functions in a file
 * (`_xldudf_NS_NAME`, ../shared/notes/formula-engine-chart-browser.md §2), `_xlfn.` prefixes, exponent case.
 */
import { describe, expect, test } from "vitest";
import { fileNameOf, fromFileFormula, normaliseTypedFormula, toFileFormula } from "../../src/preview/formulaText";

const KNOWN = ["HEADROOM.PIPEID", "HEADROOM.PIPERUN", "HEADROOM.SUPPLYCURVE"];

describe("from a file to the engine", () => {
  test("an add-in function comes back under its dotted name", () => {
    expect(fromFileFormula("_xldudf_HEADROOM_PIPEID(B36,C36,$B$9)", KNOWN)).toBe("=HEADROOM.PIPEID(B36,C36,$B$9)");
    expect(fromFileFormula("IF(A1>0,_xldudf_headroom_piperun(F48:L51,C42),0)", KNOWN)).toBe("=IF(A1>0,HEADROOM.PIPERUN(F48:L51,C42),0)");
  });

  test("the underscore is resolved by the known list, not by a rule", () => {
    // two made-up functions whose file names differ only where a dot or an underscore stood
    const known = ["NS.PUMP_SIZE", "NS.FLOW.AT"];
    expect(fileNameOf("NS.PUMP_SIZE")).toBe("_xldudf_NS_PUMP_SIZE");
    expect(fromFileFormula("_xldudf_NS_PUMP_SIZE(1)+_xldudf_NS_FLOW_AT(2)", known)).toBe("=NS.PUMP_SIZE(1)+NS.FLOW.AT(2)");
  });

  test("a function of another add-in is left as it is (the engine shows #NAME?, as Excel does without it)", () => {
    expect(fromFileFormula("_xldudf_OTHER_THING(1)", KNOWN)).toBe("=_xldudf_OTHER_THING(1)");
  });

  test("_xlfn. and _xlws. prefixes are dropped", () => {
    expect(fromFileFormula("_xlfn.IFNA(A1,0)+_xlfn._xlws.SORT(B1:B3)", KNOWN)).toBe("=IFNA(A1,0)+SORT(B1:B3)");
  });

  test("uppercase exponents become lowercase, cell references like E3 stay", () => {
    expect(fromFileFormula("1E3+2.5E-2*E3+SUM(E3:E5)+.5E+1", KNOWN)).toBe("=1e3+2.5e-2*E3+SUM(E3:E5)+.5e+1");
  });

  test("text inside string literals and quoted sheet names is never touched", () => {
    expect(fromFileFormula('"1E3 _xldudf_HEADROOM_PIPEID("&\'Run 1E3\'!A1&""""', KNOWN)).toBe(
      '="1E3 _xldudf_HEADROOM_PIPEID("&\'Run 1E3\'!A1&""""',
    );
  });
});

describe("from the engine to a file", () => {
  test("add-in functions get the file spelling, newer built-ins their prefix, the rest stays", () => {
    expect(toFileFormula("=IFNA(HEADROOM.PIPEID(B36,\"40\"),0)+SUM(A1:A2)", KNOWN)).toBe(
      '_xlfn.IFNA(_xldudf_HEADROOM_PIPEID(B36,"40"),0)+SUM(A1:A2)',
    );
    expect(toFileFormula("=headroom.piperun(F48:L51)", KNOWN)).toBe("_xldudf_HEADROOM_PIPERUN(F48:L51)");
  });

  test("there and back again gives the same formula", () => {
    const formulas = [
      "=IF(COUNT(B15:B16)=2,HEADROOM.PIPEID(B15,B16,$B$9),\"\")",
      "=HEADROOM.SUPPLYCURVE(B12,B13,B19,B72,16,$B$9)",
      "=MAX(1.5*B19,1.2*B56)",
      "=IFNA(A1,\"HEADROOM.PIPERUN(\")",
    ];
    for (const f of formulas) expect(fromFileFormula(toFileFormula(f, KNOWN), KNOWN)).toBe(f);
  });
});

describe("typed into the grid", () => {
  test("an uppercase exponent is read as a number, not as cell E3", () => {
    expect(normaliseTypedFormula("=1E3*2+E3")).toBe("=1e3*2+E3");
    expect(normaliseTypedFormula('="1E3"&2.5E-1')).toBe('="1E3"&2.5e-1');
    expect(normaliseTypedFormula("1E3")).toBe("1E3"); // not a formula: left to the number parser
  });
});
