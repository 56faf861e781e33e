/**
 * The offline manifest check (scripts/manifest-check.mjs) on the real manifest.xml and on broken copies of it: each
 * kind of break must produce its own finding. The rules checked come from the add-in manifest reference
 * (element order, resid <= 32, ShortString <= 125, LongString <= 250, icon sizes 16/32/80, shared-runtime resids),
 * summarised in ../shared/notes/office-addin-platform.md §3.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { checkManifest, pngSize, type Finding } from "../scripts/manifest-check.mjs";
import { ICON_SIZES, decodePng, renderIcon } from "../assets/make-icons.mjs";

const root = path.resolve(__dirname, "..");
const manifest = readFileSync(path.join(root, "manifest.xml"), "utf8");
const check = (xml: string, options = {}): Finding[] => checkManifest(xml, options);

/** Replaces exactly one occurrence of `from`, so a broken copy breaks exactly what the test says. */
function broken(from: string | RegExp, to: string): string {
  const count = typeof from === "string" ? manifest.split(from).length - 1 : (manifest.match(new RegExp(from, "g")) ?? []).length;
  if (count !== 1) throw new Error(`expected one occurrence of ${String(from)} in manifest.xml, found ${count}`);
  return manifest.replace(from, to);
}

function codes(findings: Finding[]): string[] {
  return findings.map((f) => f.code);
}

describe("manifest.xml", () => {
  it("passes every offline check", () => {
    expect(check(manifest)).toEqual([]);
  });

  it("is the Headroom add-in: namespace HEADROOM, shared runtime, Excel workbook host", () => {
    expect(manifest).toContain('<bt:String id="Functions.Namespace" DefaultValue="HEADROOM"/>');
    expect(manifest).toContain('<Set Name="SharedRuntime" MinVersion="1.1"/>');
    expect(manifest).toContain('<Set Name="CustomFunctionsRuntime" MinVersion="1.3"/>');
    expect(manifest).toContain('<Runtime resid="Taskpane.Url" lifetime="long"/>');
    expect(manifest).toContain('<Host Name="Workbook"/>');
    expect(manifest).toContain("<ProviderName>Headroom</ProviderName>");
  });
});

describe("broken copies of manifest.xml", () => {
  it("reports XML that is not well-formed, with its line", () => {
    const findings = check(broken("</Permissions>", "</Permission>"));
    expect(codes(findings)).toEqual(["xml"]);
    expect(findings[0].message).toMatch(/line \d+/);
  });

  it("reports a missing required element", () => {
    const findings = check(broken(/\s*<Permissions>ReadWriteDocument<\/Permissions>/, ""));
    expect(codes(findings)).toEqual(["missing-element"]);
    expect(findings[0].message).toContain("<Permissions>");
  });

  it("reports elements out of schema order", () => {
    const findings = check(broken("<Version>0.1.0.0</Version>\n  <ProviderName>Headroom</ProviderName>", "<ProviderName>Headroom</ProviderName>\n  <Version>0.1.0.0</Version>"));
    expect(codes(findings)).toEqual(["order"]);
    expect(findings[0].message).toContain("<Version> must come before <ProviderName>");
  });

  it("reports out-of-order elements inside VersionOverrides too (FunctionFile before GetStarted)", () => {
    const xml = broken(/(<GetStarted>[\s\S]*?<\/GetStarted>)(\s*)(<FunctionFile resid="Taskpane.Url"\/>)/, "$3$2$1");
    const findings = check(xml);
    expect(codes(findings)).toEqual(["order"]);
    expect(findings[0].message).toContain("<GetStarted> must come before <FunctionFile>");
  });

  it("reports an element that does not belong where it is", () => {
    const findings = check(broken("<Permissions>", "<Colour>blue</Colour>\n  <Permissions>"));
    expect(codes(findings)).toEqual(["unknown-element"]);
    expect(findings[0].message).toContain("<Colour>");
  });

  it("reports an unknown resid, naming the kind of resource it should be", () => {
    const findings = check(broken('<Label resid="Group.Label"/>', '<Label resid="Group.Lable"/>'));
    expect(codes(findings).sort()).toEqual(["resid-unknown", "unused-resource"]);
    const unknown = findings.find((f) => f.code === "resid-unknown")!;
    expect(unknown.message).toContain('"Group.Lable"');
    expect(unknown.message).toContain("ShortString");
  });

  it("reports a resid that names a resource of the wrong kind", () => {
    const findings = check(broken('<Description resid="PaneButton.Tooltip"/>', '<Description resid="PaneButton.Label"/>'));
    expect(codes(findings).sort()).toEqual(["resid-kind", "unused-resource"]);
  });

  it("reports a resid longer than 32 characters", () => {
    const long = "Headroom.Group.Label.ForTheRibbon"; // 33 characters
    expect(long.length).toBe(33);
    const xml = broken('<Label resid="Group.Label"/>', `<Label resid="${long}"/>`).replace(
      '<bt:String id="Group.Label"',
      `<bt:String id="${long}"`,
    );
    expect(codes(check(xml)).sort()).toEqual(["resid-length", "resid-length"]);
  });

  it("reports a ShortString over 125 characters and a LongString over 250", () => {
    const short = check(broken('DefaultValue="Supply vs demand"', `DefaultValue="${"x".repeat(126)}"`));
    expect(codes(short)).toEqual(["short-string-length"]);
    expect(short[0].message).toContain("126 characters, at most 125");
    const long = check(broken(/DefaultValue="Open the Headroom pane[^"]*"/, `DefaultValue="${"y".repeat(251)}"`));
    expect(codes(long)).toEqual(["long-string-length"]);
  });

  it("reports a shared-runtime resid mismatch between the Runtime and the custom-functions Page", () => {
    const xml = manifest
      .replace(/<Page>\s*<SourceLocation resid="Taskpane.Url"\/>/, '<Page>\n              <SourceLocation resid="Functions.Page.Url"/>')
      .replace("</bt:Urls>", '  <bt:Url id="Functions.Page.Url" DefaultValue="https://localhost:3000/taskpane.html"/>\n      </bt:Urls>');
    const findings = check(xml);
    expect(codes(findings)).toEqual(["runtime-resid"]);
    expect(findings[0].message).toContain("custom-functions Page");
  });

  it("reports a missing SharedRuntime requirement set", () => {
    const findings = check(broken(/\s*<Set Name="SharedRuntime" MinVersion="1.1"\/>/, ""));
    expect(codes(findings)).toEqual(["requirement-set"]);
  });

  it("reports a missing namespace", () => {
    const findings = check(broken(/\s*<Namespace resid="Functions.Namespace"\/>/, ""));
    expect(codes(findings).sort()).toEqual(["missing-element", "unused-resource"]);
    expect(findings.find((f) => f.code === "missing-element")!.message).toContain("<Namespace>");
  });

  it("reports a namespace with characters Excel does not accept", () => {
    expect(codes(check(broken('DefaultValue="HEADROOM"', 'DefaultValue="HEAD ROOM"')))).toEqual(["namespace"]);
  });

  it("reports a ribbon icon without its 80 px image", () => {
    const xml = manifest.replace(/\s*<bt:Image size="80" resid="Icon.80"\/>/g, "");
    const findings = check(xml);
    expect(codes(findings).sort()).toEqual(["icon-sizes", "icon-sizes", "unused-resource"]);
    expect(findings.find((f) => f.code === "icon-sizes")!.message).toContain("size 80");
  });

  it("reports an icon file whose pixel size does not match its declared size", () => {
    const findings = check(broken('<bt:Image size="32" resid="Icon.32"/>\n                  <bt:Image size="80" resid="Icon.80"/>\n                </Icon>\n                <Control', '<bt:Image size="32" resid="Icon.80"/>\n                  <bt:Image size="80" resid="Icon.80"/>\n                </Icon>\n                <Control'));
    expect(codes(findings)).toEqual(["icon-file"]);
    expect(findings[0].message).toContain("80×80 px, expected 32×32");
  });

  it("reports a URL that is not https", () => {
    const findings = check(broken('"https://localhost:3000/functions.json"', '"http://localhost:3000/functions.json"'));
    expect(codes(findings)).toEqual(["url-https"]);
  });

  it("reports a localhost URL naming a file that neither assets/ nor the build provides", () => {
    const icon = check(broken('"https://localhost:3000/assets/icon-80.png"', '"https://localhost:3000/assets/icon-81.png"'));
    expect(codes(icon)).toEqual(["url-file"]);
    expect(icon[0].message).toContain("not in assets/");
    const page = check(broken('<bt:Url id="Taskpane.Url" DefaultValue="https://localhost:3000/taskpane.html"/>', '<bt:Url id="Taskpane.Url" DefaultValue="https://localhost:3000/pane.html"/>'));
    expect(codes(page)).toEqual(["url-file"]);
    expect(page[0].message).toContain("does not emit");
  });

  it("reports a localhost URL on another port than the dev server", () => {
    expect(codes(check(broken('"https://localhost:3000/functions.js"', '"https://localhost:8080/functions.js"')))).toEqual(["url-origin"]);
  });

  it("with a build folder, reports files the build did not write", () => {
    const findings = check(manifest, { distDir: path.join(root, "test", "no-such-dist") });
    expect(new Set(codes(findings))).toEqual(new Set(["dist-file"]));
    expect(findings.map((f) => f.message).join("\n")).toContain("functions.json");
  });
});

describe("icons", () => {
  it.each(ICON_SIZES)("assets/icon-%i.png is the output of assets/make-icons.mjs at its size", (size) => {
    const file = path.join(root, "assets", `icon-${size}.png`);
    expect(pngSize(file)).toEqual({ width: size, height: size });
    const committed = decodePng(file);
    expect(Buffer.from(committed.data).equals(Buffer.from(renderIcon(size)))).toBe(true);
  });
});
