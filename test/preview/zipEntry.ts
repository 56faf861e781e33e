/**
 * One file out of a .zip (an .xlsx), read through its central directory with node:zlib: enough for tests to look
 * at the XML a writer produced (or, as "latin1" text, at a part's bytes), without another package.
 */
import { inflateRawSync } from "node:zlib";

export function zipEntry(zip: Uint8Array, name: string, encoding: BufferEncoding = "utf8"): string {
  const b = Buffer.from(zip.buffer, zip.byteOffset, zip.byteLength);
  const eocd = b.lastIndexOf(Buffer.from([0x50, 0x4b, 0x05, 0x06]));
  if (eocd < 0) throw new Error("not a zip file");
  const count = b.readUInt16LE(eocd + 10);
  let p = b.readUInt32LE(eocd + 16);
  for (let i = 0; i < count; i++) {
    const method = b.readUInt16LE(p + 10);
    const size = b.readUInt32LE(p + 20);
    const nameLength = b.readUInt16LE(p + 28);
    const extra = b.readUInt16LE(p + 30);
    const comment = b.readUInt16LE(p + 32);
    const local = b.readUInt32LE(p + 42);
    const entry = b.toString("utf8", p + 46, p + 46 + nameLength);
    if (entry === name) {
      const start = local + 30 + b.readUInt16LE(local + 26) + b.readUInt16LE(local + 28);
      const data = b.subarray(start, start + size);
      return (method === 8 ? inflateRawSync(data) : data).toString(encoding);
    }
    p += 46 + nameLength + extra + comment;
  }
  throw new Error(`no ${name} in the zip file`);
}
