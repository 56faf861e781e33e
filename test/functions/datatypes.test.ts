/**
 * Data-typed cells. Where Excel hands a cell's data type to an `any` parameter (it does so when functions.json allows
 * custom data, CustomFunctionsRuntime 1.4; the add-in ships without that key, see test/requirements.test.ts), the
 * value is an object of the Excel JavaScript API's cell-value shapes: `{ type: "FormattedNumber", basicValue: 500,
 * numberFormat }`, `{ type: "Entity", text, properties, basicValue: "#VALUE!" }`, ... (Excel.CellValue,
 * https://learn.microsoft.com/javascript/api/excel/excel.cellvalue). The argument checks read the basic value of the
 * types that have a plain one (Double, FormattedNumber, String, Boolean, Empty) and refuse the others with a one-line
 * message. Every expected result here is the same function called with the plain value.
 */
import { describe, expect, it } from "vitest";
import * as f from "../../src/functions/functions";
import { errorOf } from "./errors";

const formatted = (n: number, numberFormat = "0.0") => ({ type: "FormattedNumber", basicValue: n, numberFormat });
const double = (n: number) => ({ type: "Double", basicValue: n, basicType: "Double" });
const text = (s: string) => ({ type: "String", basicValue: s, basicType: "String" });
const empty = { type: "Empty", basicValue: "" };
const entity = { type: "Entity", text: "Pump house", properties: { Flow: { type: "Double", basicValue: 500 } }, basicType: "Error", basicValue: "#VALUE!" };
const image = { type: "WebImage", address: "https://example.invalid/pump.png", basicType: "Error", basicValue: "#VALUE!" };

describe("data-typed numbers are read by their basic value", () => {
  it("a formatted number or a double is the number it shows", () => {
    expect(f.friction(formatted(500), double(4.026), formatted(120, "0"), 100)).toBe(f.friction(500, 4.026, 120, 100));
    expect(f.headcount(double(1500), formatted(130))).toBe(f.headcount(1500, 130));
  });

  it("in a range too (PIPERUN's segments)", () => {
    const plain = [[500, 4.026, 120, 100]];
    expect(f.piperun([[formatted(500), double(4.026), 120, formatted(100)]])).toEqual(f.piperun(plain));
  });

  it("a data-typed nominal size is the size it shows", () => {
    expect(f.pipeid(formatted(2.5))).toBe(f.pipeid(2.5));
    expect(f.pipeid(text("2-1/2"), text("40"))).toBe(f.pipeid("2-1/2", "40"));
  });
});

describe("data-typed text and blanks are read by their basic value", () => {
  it("a data-typed code is the code it shows", () => {
    expect(f.friction(500, 4.026, 120, 100, text("SI"))).toBe(f.friction(500, 4.026, 120, 100, "SI"));
    expect(f.fittings(text("2E T"), 4)).toBe(f.fittings("2E T", 4));
  });

  it("an empty data type is an empty argument: its default when optional, the empty message when required", () => {
    expect(f.friction(500, 4.026, 120, 100, empty)).toBe(f.friction(500, 4.026, 120, 100));
    expect(errorOf(() => f.friction(empty, 4.026, 120, 100)).message).toBe("flow is empty: type a number");
  });

  it("a data-typed TRUE is refused as TRUE is", () => {
    const bool = { type: "Boolean", basicValue: true };
    expect(errorOf(() => f.friction(500, bool, 120, 100)).message).toBe(errorOf(() => f.friction(500, true, 120, 100)).message);
  });
});

describe("data types without a plain value are refused with a one-line message", () => {
  it("an entity or an image where a number belongs", () => {
    expect(errorOf(() => f.friction(entity, 4.026, 120, 100)).message).toBe('flow: got a data type (Entity "Pump house"); must be a number');
    expect(errorOf(() => f.friction(500, image, 120, 100)).message).toBe("diameter: got a data type (WebImage); must be a number");
  });

  it("an entity where a code belongs", () => {
    expect(errorOf(() => f.friction(500, 4.026, 120, 100, entity)).message).toBe('units: got a data type (Entity "Pump house"); must be one of "US", "SI"');
  });

  it("an entity in a range names its row and column", () => {
    const rows = f.piperun([[500, entity, 120, 100]]);
    expect(String((rows[0][0] as { message?: string }).message)).toBe('segments row 1 diameter: got a data type (Entity "Pump house"); must be a number');
  });

  it("an error value shows as the error", () => {
    const div0 = { type: "Error", errorType: "Div0", basicType: "Error", basicValue: "#DIV/0!" };
    expect(errorOf(() => f.friction(div0, 4.026, 120, 100)).message).toBe("flow: got #DIV/0!; must be a number");
  });

  it("an object of no known shape is never shown as [object Object]", () => {
    expect(errorOf(() => f.friction({ weird: 1 }, 4.026, 120, 100)).message).toBe("flow: got an object; must be a number");
  });
});
