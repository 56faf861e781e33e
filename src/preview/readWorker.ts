/**
 * Reads an .xlsx file off the page, in a worker of its own (./reader.ts starts it): unzipping, counting and parsing a
 * large file take seconds, and the page keeps answering meanwhile. It answers one request, the file's bytes and the
 * add-in's function names, with the workbook read (./xlsx.ts readXlsx) or the reason it could not be.
 */
import { type ReadResult, readXlsx } from "./xlsx";

export interface ReadRequest {
  bytes: ArrayBuffer;
  known: string[];
}

export type ReadAnswer = { ok: true; result: ReadResult } | { ok: false; message: string };

const scope = self as unknown as { onmessage: ((e: MessageEvent<ReadRequest>) => void) | null; postMessage(answer: ReadAnswer): void };

scope.onmessage = (e) => {
  readXlsx(e.data.bytes, e.data.known).then(
    (result) => scope.postMessage({ ok: true, result }),
    (err: unknown) => scope.postMessage({ ok: false, message: err instanceof Error ? err.message : String(err) }),
  );
};
