/**
 * Offline checks of Headroom's XML add-in manifest (the hosted validator needs the network).
 *
 * `checkManifest(xml, options)` returns a list of findings, each `{ code, message, at }`; an empty list means the
 * manifest passed. It checks what the platform rejects or silently ignores (see ../shared/notes/office-addin-platform.md §3):
 *   - well-formed XML, the OfficeApp / VersionOverrides namespaces and types;
 *   - required elements present and every element in schema order (the XSD sequences, as the manifest
 *     element-ordering page lists them), no unknown or repeated elements where only one is allowed;
 *   - every resid (<= 32 characters) resolving to a resource of the right kind (bt:Image, bt:Url, ShortString,
 *     LongString); resource ids unique and all used; ShortStrings <= 125 characters, LongStrings <= 250;
 *   - shared runtime: Runtime, custom-functions Page, FunctionFile and ShowTaskpane all on the same resid, lifetime
 *     "long", and the SharedRuntime / CustomFunctionsRuntime requirement sets declared;
 *   - the custom-functions namespace present (letters, digits and periods);
 *   - every ribbon Icon with images of sizes 16, 32 and 80, each file a PNG of exactly that size;
 *   - every URL https; every localhost URL on the dev origin and naming a file that exists: an icon in assets/
 *     (copied to dist/assets by the build) or a file the webpack build emits; with `distDir`, present in that folder.
 */
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { XMLParser, XMLValidator } from "fast-xml-parser";

const here = path.dirname(fileURLToPath(import.meta.url));

/** Files the webpack build writes at the top of dist/ (besides assets/). */
export const BUILD_OUTPUTS = ["functions.js", "functions.json", "taskpane.html"];
export const DEFAULT_OPTIONS = {
  assetsDir: path.resolve(here, "..", "assets"),
  devOrigin: "https://localhost:3000",
  buildOutputs: BUILD_OUTPUTS,
  distDir: undefined,
};

const NS_OFFICEAPP = "http://schemas.microsoft.com/office/appforoffice/1.1";
const NS_BT = "http://schemas.microsoft.com/office/officeappbasictypes/1.0";
const NS_TASKPANE_OVERRIDES = "http://schemas.microsoft.com/office/taskpaneappversionoverrides";

export const RESID_MAX = 32;
export const SHORT_STRING_MAX = 125;
export const LONG_STRING_MAX = 250;
const URL_MAX = 2048;
const REQUIRED_ICON_SIZES = [16, 32, 80];
const ALLOWED_ICON_SIZES = [16, 20, 24, 32, 40, 48, 64, 80];
const PERMISSIONS = ["Restricted", "ReadDocument", "ReadAllDocument", "WriteDocument", "ReadWriteDocument"];

/**
 * Child sequences (schema order) by element. `*` marks an element that may repeat; others occur at most once.
 * Keys are resolved by `sequenceKey`, which tells apart the elements whose content depends on the context.
 */
const SEQUENCES = {
  OfficeApp: [
    "Id", "AlternateId", "Version", "ProviderName", "DefaultLocale", "DisplayName", "Description", "IconUrl",
    "HighResolutionIconUrl", "SupportUrl", "AppDomains", "Hosts", "Requirements", "DefaultSettings", "Permissions",
    "Dictionary", "VersionOverrides", "ExtendedOverrides",
  ],
  AppDomains: ["AppDomain*"],
  "OfficeApp/Hosts": ["Host*"],
  Requirements: ["Sets", "Methods"],
  Sets: ["Set*"],
  Methods: ["Method*"],
  DefaultSettings: ["SourceLocation"],
  VersionOverrides: ["Description", "Requirements", "Hosts", "Resources", "WebApplicationInfo", "EquivalentAddins"],
  "VersionOverrides/Hosts": ["Host*"],
  "VersionOverrides/Host": ["Runtimes", "AllFormFactors", "DesktopFormFactor"],
  Runtimes: ["Runtime*"],
  AllFormFactors: ["ExtensionPoint*"],
  "ExtensionPoint:CustomFunctions": ["Script", "Page", "Metadata", "Namespace"],
  Script: ["SourceLocation"],
  Page: ["SourceLocation"],
  Metadata: ["SourceLocation"],
  DesktopFormFactor: ["GetStarted", "FunctionFile", "ExtensionPoint*"],
  GetStarted: ["Title", "Description", "LearnMoreUrl"],
  "ExtensionPoint:PrimaryCommandSurface": ["OfficeTab", "CustomTab*"],
  "ExtensionPoint:ContextMenu": ["OfficeMenu*"],
  OfficeTab: ["Group*"],
  Group: ["OverriddenByRibbonApi", "Label", "Icon", "Control*"],
  Control: ["OverriddenByRibbonApi", "Label", "Supertip", "Icon", "Action", "Enabled", "Items"],
  Supertip: ["Title", "Description"],
  Icon: ["bt:Image*"],
  Action: ["TaskpaneId", "SourceLocation", "Title", "FunctionName"],
  Resources: ["bt:Images", "bt:Urls", "bt:ShortStrings", "bt:LongStrings"],
  "bt:Images": ["bt:Image*"],
  "bt:Urls": ["bt:Url*"],
  "bt:ShortStrings": ["bt:String*"],
  "bt:LongStrings": ["bt:String*"],
};

/** Children that must be present, by the same keys. */
const REQUIRED = {
  OfficeApp: ["Id", "Version", "ProviderName", "DefaultLocale", "DisplayName", "Description", "DefaultSettings", "Permissions"],
  DefaultSettings: ["SourceLocation"],
  "ExtensionPoint:CustomFunctions": ["Script", "Page", "Metadata", "Namespace"],
  Script: ["SourceLocation"],
  Page: ["SourceLocation"],
  Metadata: ["SourceLocation"],
  GetStarted: ["Title", "Description", "LearnMoreUrl"],
  Group: ["Label", "Icon", "Control"],
  Control: ["Label", "Supertip", "Icon", "Action"],
  Supertip: ["Title", "Description"],
  "Action:ShowTaskpane": ["SourceLocation"],
  "Action:ExecuteFunction": ["FunctionName"],
};

/** The kind of resource a `resid` on this element must name. */
const RESID_KIND = {
  "bt:Image": "bt:Images",
  SourceLocation: "bt:Urls",
  FunctionFile: "bt:Urls",
  LearnMoreUrl: "bt:Urls",
  Runtime: "bt:Urls",
  Label: "bt:ShortStrings",
  Title: "bt:ShortStrings",
  Namespace: "bt:ShortStrings",
  Description: "bt:LongStrings",
};
const KIND_LABEL = {
  "bt:Images": "a bt:Image",
  "bt:Urls": "a bt:Url",
  "bt:ShortStrings": "a ShortString",
  "bt:LongStrings": "a LongString",
};

// ─── Tree ────────────────────────────────────────────────────────────────────────────────────────────────────────

function toTree(ordered, parentPath = "") {
  const nodes = [];
  for (const entry of ordered) {
    const name = Object.keys(entry).find((k) => k !== ":@");
    if (!name || name === "#text" || name.startsWith("?") || name === "#comment") continue;
    const at = parentPath ? `${parentPath}/${name}` : name;
    const content = entry[name] ?? [];
    const text = content
      .filter((c) => "#text" in c)
      .map((c) => String(c["#text"]))
      .join("")
      .trim();
    const node = { name, attrs: entry[":@"] ?? {}, text, at, children: [] };
    node.children = toTree(content, at).map((c) => ((c.parent = node), c));
    nodes.push(node);
  }
  return nodes;
}

function* walk(node) {
  yield node;
  for (const c of node.children) yield* walk(c);
}

const child = (node, name) => node?.children.find((c) => c.name === name);
const childrenNamed = (node, name) => node?.children.filter((c) => c.name === name) ?? [];
const xsiType = (node) => node?.attrs["xsi:type"];

function sequenceKey(node) {
  const parent = node.parent?.name;
  if (node.name === "Hosts" || node.name === "Host") {
    const insideOverrides = node.at.includes("VersionOverrides/");
    if (node.name === "Hosts") return insideOverrides ? "VersionOverrides/Hosts" : "OfficeApp/Hosts";
    return insideOverrides ? "VersionOverrides/Host" : null;
  }
  if (node.name === "ExtensionPoint") return `ExtensionPoint:${xsiType(node)}`;
  if (node.name === "Action") return `Action:${xsiType(node)}`;
  if (node.name === "Description" || node.name === "Title") return null; // leaf references
  if (node.name === "Requirements" && parent !== "OfficeApp" && parent !== "VersionOverrides") return null;
  return node.name;
}

// ─── PNG size ────────────────────────────────────────────────────────────────────────────────────────────────────

const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

/** Width and height from a PNG's IHDR chunk, or null when the file is not a PNG. */
export function pngSize(file) {
  const bytes = readFileSync(file);
  if (bytes.length < 24 || !bytes.subarray(0, 8).equals(PNG_SIGNATURE) || bytes.toString("latin1", 12, 16) !== "IHDR") {
    return null;
  }
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

// ─── The check ───────────────────────────────────────────────────────────────────────────────────────────────────

/**
 * @param {string} xml the manifest text
 * @param {Partial<typeof DEFAULT_OPTIONS>} [options]
 * @returns {{ code: string, message: string, at: string }[]}
 */
export function checkManifest(xml, options = {}) {
  const opts = { ...DEFAULT_OPTIONS, ...options };
  const findings = [];
  const add = (code, message, at = "") => findings.push({ code, message, at });

  const wellFormed = XMLValidator.validate(xml);
  if (wellFormed !== true) {
    const { msg, line, col } = wellFormed.err;
    add("xml", `not well-formed XML: ${msg} (line ${line}, column ${col})`);
    return findings;
  }
  const parser = new XMLParser({
    preserveOrder: true,
    ignoreAttributes: false,
    attributeNamePrefix: "",
    parseAttributeValue: false,
    parseTagValue: false,
    trimValues: true,
  });
  const roots = toTree(parser.parse(xml));
  const root = roots[0];
  if (roots.length !== 1 || root.name !== "OfficeApp") {
    add("root", `the root element must be OfficeApp, found ${roots.map((r) => r.name).join(", ") || "none"}`);
    return findings;
  }

  checkRoot(root, add);
  checkStructure(root, add);
  const resources = collectResources(root, add);
  checkResids(root, resources, add);
  checkSharedRuntime(root, add);
  checkNamespace(root, resources, add);
  checkIcons(root, resources, opts, add);
  checkUrls(root, opts, add);
  return findings;
}

function checkRoot(root, add) {
  if (root.attrs.xmlns !== NS_OFFICEAPP) add("namespace", `OfficeApp xmlns must be "${NS_OFFICEAPP}", found "${root.attrs.xmlns ?? ""}"`, root.at);
  if (xsiType(root) !== "TaskPaneApp") add("root", `OfficeApp xsi:type must be "TaskPaneApp", found "${xsiType(root) ?? ""}"`, root.at);
  if (root.attrs["xmlns:bt"] !== NS_BT) add("namespace", `OfficeApp must declare xmlns:bt="${NS_BT}"`, root.at);

  const id = child(root, "Id");
  if (id && !/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(id.text)) {
    add("value", `Id must be a GUID, found "${id.text}"`, id.at);
  }
  const version = child(root, "Version");
  if (version && !/^\d{1,5}(\.\d{1,5}){0,3}$/.test(version.text)) {
    add("value", `Version must be up to four dot-separated numbers (e.g. 1.0.0.0), found "${version.text}"`, version.at);
  }
  const provider = child(root, "ProviderName");
  if (provider) checkLength("value", "ProviderName", provider.text, 1, SHORT_STRING_MAX, provider.at, add);
  const display = child(root, "DisplayName");
  if (display) checkLength("value", "DisplayName DefaultValue", display.attrs.DefaultValue ?? "", 1, SHORT_STRING_MAX, display.at, add);
  const description = child(root, "Description");
  if (description) checkLength("value", "Description DefaultValue", description.attrs.DefaultValue ?? "", 1, LONG_STRING_MAX, description.at, add);
  const permissions = child(root, "Permissions");
  if (permissions && !PERMISSIONS.includes(permissions.text)) {
    add("value", `Permissions must be one of ${PERMISSIONS.join(", ")}, found "${permissions.text}"`, permissions.at);
  }
  const hosts = childrenNamed(child(root, "Hosts"), "Host").map((h) => h.attrs.Name);
  if (!hosts.includes("Workbook")) add("host", `Hosts must list <Host Name="Workbook"/> (Excel), found ${hosts.join(", ") || "none"}`, `${root.at}/Hosts`);

  const overrides = child(root, "VersionOverrides");
  if (overrides) {
    if (overrides.attrs.xmlns !== NS_TASKPANE_OVERRIDES) {
      add("namespace", `VersionOverrides xmlns must be "${NS_TASKPANE_OVERRIDES}", found "${overrides.attrs.xmlns ?? ""}"`, overrides.at);
    }
    if (xsiType(overrides) !== "VersionOverridesV1_0") {
      add("value", `VersionOverrides xsi:type must be "VersionOverridesV1_0" for a task pane add-in, found "${xsiType(overrides) ?? ""}"`, overrides.at);
    }
    const vHosts = childrenNamed(child(overrides, "Hosts"), "Host");
    if (!vHosts.some((h) => xsiType(h) === "Workbook")) add("host", `VersionOverrides Hosts must contain <Host xsi:type="Workbook">`, overrides.at);
  }
}

function checkLength(code, what, value, min, max, at, add) {
  if (value.length < min) add(code, `${what} is empty`, at);
  else if (value.length > max) add(code, `${what} is ${value.length} characters, at most ${max} allowed`, at);
}

function checkStructure(root, add) {
  for (const node of walk(root)) {
    const key = sequenceKey(node);
    const sequence = key ? SEQUENCES[key] : undefined;
    const required = key ? REQUIRED[key] : undefined;
    if (required) {
      for (const name of required) {
        if (!child(node, name)) add("missing-element", `<${node.name}> is missing its required <${name}>`, node.at);
      }
    }
    if (!sequence) continue;
    const names = sequence.map((s) => s.replace(/\*$/, ""));
    let last = -1;
    let lastName = "";
    for (const c of node.children) {
      const index = names.indexOf(c.name);
      if (index < 0) {
        add("unknown-element", `<${c.name}> is not an allowed child of <${node.name}> (allowed, in order: ${names.join(", ")})`, c.at);
        continue;
      }
      const repeatable = sequence[index].endsWith("*");
      if (index < last) {
        add("order", `<${c.name}> must come before <${lastName}> inside <${node.name}> (schema order: ${names.join(", ")})`, c.at);
      } else if (index === last && !repeatable) {
        add("duplicate-element", `<${c.name}> may appear only once inside <${node.name}>`, c.at);
      }
      if (index >= last) {
        last = index;
        lastName = c.name;
      }
    }
  }
}

/** Map of resource id -> { kind, value, at }; reports duplicates, bad ids and over-long strings. */
function collectResources(root, add) {
  const resources = new Map();
  const resourcesNode = child(child(root, "VersionOverrides"), "Resources");
  if (!resourcesNode) return resources;
  for (const group of resourcesNode.children) {
    if (!KIND_LABEL[group.name]) continue;
    for (const item of group.children) {
      const id = item.attrs.id ?? "";
      const value = item.attrs.DefaultValue ?? "";
      if (!id) {
        add("resource-id", `a <${item.name}> in <${group.name}> has no id`, item.at);
        continue;
      }
      if (id.length > RESID_MAX) add("resid-length", `resource id "${id}" is ${id.length} characters, at most ${RESID_MAX} allowed`, item.at);
      if (resources.has(id)) add("duplicate-id", `resource id "${id}" is defined more than once`, item.at);
      if (group.name === "bt:ShortStrings") checkLength("short-string-length", `ShortString "${id}"`, value, 1, SHORT_STRING_MAX, item.at, add);
      if (group.name === "bt:LongStrings") checkLength("long-string-length", `LongString "${id}"`, value, 1, LONG_STRING_MAX, item.at, add);
      if ((group.name === "bt:Urls" || group.name === "bt:Images") && !value) add("url", `${KIND_LABEL[group.name]} "${id}" has no DefaultValue`, item.at);
      resources.set(id, { kind: group.name, value, at: item.at, used: false });
    }
  }
  return resources;
}

function checkResids(root, resources, add) {
  for (const node of walk(root)) {
    if (!("resid" in node.attrs)) continue;
    const resid = node.attrs.resid;
    if (!resid) {
      add("resid-unknown", `<${node.name}> has an empty resid`, node.at);
      continue;
    }
    if (resid.length > RESID_MAX) add("resid-length", `resid "${resid}" on <${node.name}> is ${resid.length} characters, at most ${RESID_MAX} allowed`, node.at);
    const want = RESID_KIND[node.name];
    const found = resources.get(resid);
    if (!found) {
      add("resid-unknown", `resid "${resid}" on <${node.name}> names no resource${want ? ` (expected ${KIND_LABEL[want]})` : ""}`, node.at);
      continue;
    }
    found.used = true;
    if (want && found.kind !== want) {
      add("resid-kind", `resid "${resid}" on <${node.name}> must name ${KIND_LABEL[want]}, but it is ${KIND_LABEL[found.kind]}`, node.at);
    }
  }
  for (const [id, r] of resources) {
    if (!r.used) add("unused-resource", `resource "${id}" is defined but no element uses it`, r.at);
  }
}

function checkSharedRuntime(root, add) {
  const overrides = child(root, "VersionOverrides");
  const sets = childrenNamed(child(child(root, "Requirements"), "Sets"), "Set").map((s) => s.attrs.Name);
  for (const host of childrenNamed(child(overrides, "Hosts"), "Host")) {
    const runtimes = childrenNamed(child(host, "Runtimes"), "Runtime");
    const customFunctions = childrenNamed(child(host, "AllFormFactors"), "ExtensionPoint").find((e) => xsiType(e) === "CustomFunctions");
    if (customFunctions && !sets.includes("CustomFunctionsRuntime")) {
      add("requirement-set", `custom functions need <Set Name="CustomFunctionsRuntime" .../> in OfficeApp Requirements`, customFunctions.at);
    }
    if (runtimes.length === 0) continue;
    if (!sets.includes("SharedRuntime")) add("requirement-set", `a shared runtime needs <Set Name="SharedRuntime" MinVersion="1.1"/> in OfficeApp Requirements`, host.at);
    if (runtimes.length > 1) add("runtime", `only one shared Runtime is supported, found ${runtimes.length}`, host.at);
    const runtime = runtimes[0];
    const resid = runtime.attrs.resid;
    if (runtime.attrs.lifetime !== "long") add("runtime", `Runtime lifetime must be "long" so custom functions run while the pane is closed, found "${runtime.attrs.lifetime ?? ""}"`, runtime.at);
    const users = [];
    const page = child(child(customFunctions, "Page"), "SourceLocation");
    if (page) users.push(["custom-functions Page", page]);
    const desktop = child(host, "DesktopFormFactor");
    const functionFile = child(desktop, "FunctionFile");
    if (functionFile) users.push(["FunctionFile", functionFile]);
    for (const node of walk(desktop ?? { children: [] })) {
      if (node.name === "Action" && xsiType(node) === "ShowTaskpane") {
        const location = child(node, "SourceLocation");
        if (location) users.push(["ShowTaskpane SourceLocation", location]);
      }
    }
    for (const [what, node] of users) {
      if (node.attrs.resid !== resid) {
        add("runtime-resid", `${what} uses resid "${node.attrs.resid ?? ""}" but the shared Runtime uses "${resid}": they must be the same`, node.at);
      }
    }
  }
}

function checkNamespace(root, resources, add) {
  const overrides = child(root, "VersionOverrides");
  for (const host of childrenNamed(child(overrides, "Hosts"), "Host")) {
    const ep = childrenNamed(child(host, "AllFormFactors"), "ExtensionPoint").find((e) => xsiType(e) === "CustomFunctions");
    if (!ep) continue;
    const ns = child(ep, "Namespace");
    if (!ns) continue; // reported as a missing element
    const value = resources.get(ns.attrs.resid ?? "")?.value;
    if (value === undefined) continue; // reported as an unknown resid
    if (!/^[A-Za-z][A-Za-z0-9.]*$/.test(value)) {
      add("namespace", `custom-functions namespace "${value}" must start with a letter and hold only letters, digits and periods`, ns.at);
    }
  }
}

/** Local file behind a dev-origin URL, or null when the URL is not on the dev origin. */
function devPath(url, opts) {
  if (!url.startsWith(`${opts.devOrigin}/`)) return null;
  return decodeURIComponent(url.slice(opts.devOrigin.length + 1).split(/[?#]/)[0]);
}

function assetFile(relative, opts) {
  if (!relative.startsWith("assets/")) return null;
  const name = relative.slice("assets/".length);
  if (!name || name.includes("/") || name.includes("\\")) return null;
  return path.join(opts.assetsDir, name);
}

function checkIcons(root, resources, opts, add) {
  const wantSize = (url, width, at, what) => {
    const relative = devPath(url, opts);
    const file = relative && assetFile(relative, opts);
    if (!file || !existsSync(file)) return; // a missing file is reported by checkUrls
    const size = pngSize(file);
    if (!size) add("icon-file", `${what} ${relative} is not a PNG file`, at);
    else if (size.width !== width || size.height !== width) {
      add("icon-file", `${what} ${relative} is ${size.width}×${size.height} px, expected ${width}×${width}`, at);
    }
  };
  for (const node of walk(root)) {
    if (node.name !== "Icon") continue;
    const sizes = node.children.filter((c) => c.name === "bt:Image").map((c) => Number(c.attrs.size));
    for (const size of REQUIRED_ICON_SIZES) {
      if (!sizes.includes(size)) add("icon-sizes", `<Icon> has no bt:Image of size ${size} (sizes 16, 32 and 80 are required)`, node.at);
    }
    const seen = new Set();
    for (const img of node.children.filter((c) => c.name === "bt:Image")) {
      const size = Number(img.attrs.size);
      if (!ALLOWED_ICON_SIZES.includes(size)) add("icon-sizes", `bt:Image size "${img.attrs.size ?? ""}" is not one of ${ALLOWED_ICON_SIZES.join(", ")}`, img.at);
      if (seen.has(size)) add("icon-sizes", `<Icon> lists size ${size} twice`, img.at);
      seen.add(size);
      const r = resources.get(img.attrs.resid ?? "");
      if (r?.kind === "bt:Images" && r.value) wantSize(r.value, size, img.at, `icon "${img.attrs.resid}"`);
    }
  }
  const icon = child(root, "IconUrl");
  if (icon?.attrs.DefaultValue) wantSize(icon.attrs.DefaultValue, 32, icon.at, "IconUrl");
  const hiRes = child(root, "HighResolutionIconUrl");
  if (hiRes?.attrs.DefaultValue) wantSize(hiRes.attrs.DefaultValue, 64, hiRes.at, "HighResolutionIconUrl");
}

function checkUrls(root, opts, add) {
  const urls = [];
  const overrides = child(root, "VersionOverrides");
  for (const name of ["IconUrl", "HighResolutionIconUrl", "SupportUrl"]) {
    const node = child(root, name);
    if (node) urls.push([node.attrs.DefaultValue ?? "", node.at, name]);
  }
  const defaultLocation = child(child(root, "DefaultSettings"), "SourceLocation");
  if (defaultLocation) urls.push([defaultLocation.attrs.DefaultValue ?? "", defaultLocation.at, "DefaultSettings SourceLocation"]);
  for (const domain of childrenNamed(child(root, "AppDomains"), "AppDomain")) urls.push([domain.text, domain.at, "AppDomain"]);
  const resourcesNode = child(overrides, "Resources");
  for (const group of ["bt:Urls", "bt:Images"]) {
    for (const item of childrenNamed(child(resourcesNode, group), group.slice(0, -1))) {
      if (item.attrs.DefaultValue) urls.push([item.attrs.DefaultValue, item.at, `${KIND_LABEL[group]} "${item.attrs.id}"`]);
      for (const o of childrenNamed(item, "bt:Override")) urls.push([o.attrs.Value ?? "", o.at, `override of "${item.attrs.id}"`]);
    }
  }
  for (const [url, at, what] of urls) {
    if (!url) {
      add("url", `${what} has no URL`, at);
      continue;
    }
    if (url.length > URL_MAX) add("url", `${what} URL is longer than ${URL_MAX} characters`, at);
    let parsed;
    try {
      parsed = new URL(url);
    } catch {
      add("url", `${what} "${url}" is not a valid URL`, at);
      continue;
    }
    if (parsed.protocol !== "https:") {
      add("url-https", `${what} "${url}" must use https`, at);
      continue;
    }
    if (parsed.hostname !== "localhost") continue;
    const relative = devPath(url, opts);
    if (relative === null) {
      add("url-origin", `${what} "${url}" must be on the dev server ${opts.devOrigin}`, at);
      continue;
    }
    const asset = assetFile(relative, opts);
    if (asset) {
      if (!existsSync(asset)) add("url-file", `${what} "${url}" names ${relative}, which is not in assets/`, at);
      else if (!relative.endsWith(".png")) add("url-file", `${what} "${url}" names ${relative}, but the build copies only assets/*.png`, at);
    } else if (!opts.buildOutputs.includes(relative)) {
      add("url-file", `${what} "${url}" names ${relative || "/"}, which the build does not emit (it emits ${opts.buildOutputs.join(", ")} and assets/*.png)`, at);
    }
    if (opts.distDir && (asset || opts.buildOutputs.includes(relative)) && !existsSync(path.join(opts.distDir, relative))) {
      add("dist-file", `${what} "${url}" names ${relative}, which is missing from ${opts.distDir}`, at);
    }
  }
}
