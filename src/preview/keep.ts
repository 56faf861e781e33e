/**
 * Unsaved work kept in the browser: after each change (at the page's next idle moment, within KEEP_WITHIN_MS) the
 * open workbook is written to the browser's IndexedDB (the platform's store for structured data; no size limit worth
 * the name for a workbook, unlike localStorage's few megabytes of text), so that after a reload or a crash the page can
 * offer it back. Only unsaved work is kept: once the workbook is saved, or the user discards the changes (another file
 * opened, the offer declined), the copy goes.
 *
 * One copy per browser profile and origin: two tabs of the preview share it (the latest change wins).
 */
import type { WorkbookData } from "./model";
import type { PreviewWorkbook } from "./workbook";

/** A workbook kept with what the page needs to show it again. */
export interface KeptWork {
  /** the name it goes by (the file opened or saved, or the sample) */
  fileName: string;
  /** the sample it was opened from, if it was never saved under a name of the user's */
  sample: string | null;
  /** when it was kept, ms since 1970 */
  keptAt: number;
  data: WorkbookData;
}

/**
 * What the user typed as a file name, made one: characters no file system takes dropped, ".xlsx" added where it is
 * missing; "" if nothing is left.
 */
export function cleanFileName(typed: string): string {
  // eslint-disable-next-line no-control-regex
  const cleaned = typed.replace(/[\u0000-\u001f\\/:*?"<>|]/g, "").replace(/\s+/g, " ").trim();
  const ext = /\.xlsx$/i.exec(cleaned)?.[0] ?? ".xlsx";
  const base = cleaned.slice(0, cleaned.length - (/\.xlsx$/i.test(cleaned) ? ext.length : 0)).replace(/^[.\s]+/, "").trimEnd();
  return base ? `${base}${ext}` : "";
}

const DATABASE = "headroom-preview";
const STORE = "work";
const KEY = "unsaved";

let opening: Promise<IDBDatabase> | undefined;

function database(): Promise<IDBDatabase> {
  opening ??= new Promise((resolve, reject) => {
    const r = indexedDB.open(DATABASE, 1);
    r.onupgradeneeded = () => r.result.createObjectStore(STORE);
    r.onsuccess = () => resolve(r.result);
    r.onerror = () => reject(r.error ?? new Error("the browser's storage did not open"));
  });
  return opening;
}

/** One request in its own transaction; resolves once the transaction is complete (written, for a write). */
async function inStore<T>(mode: IDBTransactionMode, request: (store: IDBObjectStore) => IDBRequest<T>): Promise<T> {
  const db = await database();
  return new Promise<T>((resolve, reject) => {
    const tx = db.transaction(STORE, mode);
    const r = request(tx.objectStore(STORE));
    tx.oncomplete = () => resolve(r.result);
    tx.onerror = () => reject(tx.error ?? r.error ?? new Error("the browser's storage refused the request"));
    tx.onabort = () => reject(tx.error ?? new Error("the browser's storage gave up the request"));
  });
}

/** The longest a change waits to be kept, ms: the page's next idle moment, or this long if it is never idle. */
export const KEEP_WITHIN_MS = 500;

/** Resolves at the page's next idle moment (requestIdleCallback), or after KEEP_WITHIN_MS at the latest. */
function whenIdle(): Promise<void> {
  return new Promise((resolve) => {
    if (typeof requestIdleCallback === "function") requestIdleCallback(() => resolve(), { timeout: KEEP_WITHIN_MS });
    else setTimeout(resolve, 0);
  });
}

/** The work kept, if any. */
export async function keptWork(): Promise<KeptWork | undefined> {
  return (await inStore("readonly", (s) => s.get(KEY) as IDBRequest<KeptWork | undefined>)) ?? undefined;
}

/**
 * Keeps the open workbook in the browser while it holds changes not saved: after each change (writes one at a time,
 * the latest state last), never while `hold` is on.
 */
export class Keeper {
  /** the workbook's revision when it was last opened or saved */
  private clean: number;
  private held = false;
  private queued = false;
  private chain: Promise<void> = Promise.resolve();
  private readonly listeners = new Set<(dirty: boolean) => void>();
  private wasDirty = false;
  private failed: Error | null = null;

  constructor(
    private readonly wb: PreviewWorkbook,
    /** what the page calls the workbook now */
    private readonly describe: () => { fileName: string; sample: string | null },
    /** told when keeping fails (storage full or refused) */
    private readonly onError: (e: Error) => void,
  ) {
    this.clean = wb.revision;
    wb.onChange(() => this.changed());
  }

  /** Whether the workbook holds changes not saved. */
  get dirty(): boolean {
    return this.wb.revision !== this.clean;
  }

  /** Call `listener` whenever `dirty` turns. */
  onDirty(listener: (dirty: boolean) => void): void {
    this.listeners.add(listener);
  }

  /**
   * The workbook as it is (or as it was at `revision`) counts as saved: just opened, or written to a file. The kept
   * copy goes.
   */
  markClean(revision = this.wb.revision): Promise<void> {
    this.clean = revision;
    this.tell();
    const forgotten = this.forget();
    // changed since `revision` (an edit while the file was written): kept again, after the old copy went
    this.changed();
    return forgotten;
  }

  /** While on, nothing is written (a kept copy waits for the user's answer). Off: the workbook is kept if it must be. */
  hold(on: boolean): void {
    this.held = on;
    if (!on) this.changed();
  }

  /** Forget the kept copy (the user declined it). */
  forget(): Promise<void> {
    return this.then(() => inStore("readwrite", (s) => s.delete(KEY)).then(() => undefined));
  }

  /** Resolves when every write asked for so far is done. */
  idle(): Promise<void> {
    return this.chain;
  }

  private changed(): void {
    this.tell();
    if (!this.dirty || this.held || this.queued) return;
    this.queued = true;
    // when the page is idle (at most KEEP_WITHIN_MS after the change): one write for a burst of changes, and the
    // workbook written out while the user is not waiting for the sheet or the pane to redraw
    this.then(
      () =>
        whenIdle().then(() => {
          this.queued = false;
          if (!this.dirty || this.held) return undefined;
          const entry: KeptWork = { ...this.describe(), keptAt: Date.now(), data: this.wb.contentData() };
          return inStore("readwrite", (s) => s.put(entry, KEY)).then(() => undefined);
        }),
    );
  }

  /** Why the last write or forgetting failed, or null where the last one went through. */
  get failing(): Error | null {
    return this.failed;
  }

  private then(step: () => Promise<void>): Promise<void> {
    this.chain = this.chain
      .then(step)
      .then(() => {
        this.failed = null;
      })
      .catch((e: unknown) => {
        this.failed = e instanceof Error ? e : new Error(String(e));
        this.onError(this.failed);
      });
    return this.chain;
  }

  private tell(): void {
    const dirty = this.dirty;
    if (dirty === this.wasDirty) return;
    this.wasDirty = dirty;
    for (const l of [...this.listeners]) l(dirty);
  }
}
