/**
 * The preview's status line: what the last action did, or what is wrong. An error says something about the workbook
 * (a share copy refused for its demo values, no summary while inputs need attention, work that could not be kept in
 * the browser); it never stays red over a workbook that is fine: at each change the page calls `changed`, and an error
 * that comes with a check is checked again (it goes, or says what holds now), one without (an action that failed) goes.
 */

/** Whether an error still holds: its text as it reads now, or null when it no longer holds. */
export type Recheck = () => string | null | Promise<string | null>;

export class StatusLine {
  private recheck: Recheck | null = null;
  private isError = false;
  /** counts what the line was told, so that a check finishing late never undoes a newer message */
  private told = 0;

  constructor(private readonly el: HTMLElement) {}

  /** What an action did: plain text. */
  show(text: string): void {
    this.set(text, false, null);
  }

  /** What is wrong, in red; `recheck` says whether it still holds after a change (without: it goes at the next one). */
  error(text: string, recheck?: Recheck): void {
    this.set(text, true, recheck ?? null);
  }

  /** The workbook changed: an error is checked again, and cleared where it no longer holds. */
  async changed(): Promise<void> {
    if (!this.isError) return;
    const told = this.told;
    const recheck = this.recheck;
    const now = recheck ? await recheck() : null;
    if (told !== this.told) return; // told something newer meanwhile
    if (now === null) this.set("", false, null);
    else if (now !== this.el.textContent) this.set(now, true, recheck);
  }

  /** the text shown and whether it is an error, for tests */
  get state(): { text: string; error: boolean } {
    return { text: this.el.textContent ?? "", error: this.isError };
  }

  private set(text: string, error: boolean, recheck: Recheck | null): void {
    this.told++;
    this.el.textContent = text;
    this.el.classList.toggle("is-error", error);
    this.isError = error;
    this.recheck = recheck;
  }
}

/**
 * What the sample menu shows: the sample open (its file, the option's value), or, for anything else in the grid (a
 * file opened, work saved under a name of the user's, work kept in the browser that was no sample), a first option of
 * its own, "Your file: <name>", selected and disabled, so that the menu never names a sample the grid does not show.
 */
export function showInPicker(picker: HTMLSelectElement, sample: string | null, fileName: string): void {
  const own = picker.querySelector<HTMLOptionElement>('option[data-role="own-file"]');
  const isSample = sample !== null && [...picker.options].some((o) => o.value === sample && o !== own);
  if (isSample) {
    own?.remove();
    picker.value = sample;
    return;
  }
  const option = own ?? picker.ownerDocument.createElement("option");
  option.dataset.role = "own-file";
  option.value = "";
  option.disabled = true;
  option.textContent = `Your file: ${fileName}`;
  if (!own) picker.prepend(option);
  option.selected = true;
}
