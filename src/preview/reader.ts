/**
 * Opening a file without holding the page still: the bytes go to a worker (./readWorker.ts) that unzips, counts and
 * parses them, and the page only receives the workbook read, or the reason it could not be. Where the browser
 * cannot start the worker, the file is read on the page instead (the same ./xlsx.ts readXlsx, only slower to answer);
 * a worker that started and then failed ends the open with its error (the bytes were handed to it).
 */
import type { ReadAnswer, ReadRequest } from "./readWorker";
import type { ReadResult } from "./xlsx";

export async function readOffPage(bytes: ArrayBuffer, known: readonly string[]): Promise<ReadResult> {
  let worker: Worker;
  try {
    worker = new Worker(new URL("./readWorker.ts", import.meta.url), { name: "xlsx-reader" });
  } catch {
    const { readXlsx } = await import(/* webpackChunkName: "xlsx" */ "./xlsx");
    return readXlsx(bytes, known);
  }
  return new Promise<ReadResult>((resolve, reject) => {
    worker.onmessage = (e: MessageEvent<ReadAnswer>) => {
      worker.terminate();
      // answered from a task of its own: taking the message in and building the workbook from it are two stalls, not one
      if (e.data.ok) setTimeout(resolve, 0, e.data.result);
      else reject(new Error(e.data.message));
    };
    worker.onerror = (e) => {
      worker.terminate();
      e.preventDefault();
      reject(new Error(e.message || "the file reader stopped"));
    };
    const request: ReadRequest = { bytes, known: [...known] };
    // the bytes are handed over, not copied
    worker.postMessage(request, [bytes]);
  });
}
