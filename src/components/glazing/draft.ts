/** The composer's working draft in the browser's storage: a reload, or opening a make-up from the library page, loses nothing. */
export const COMPOSER_DRAFT_KEY = "paneray.composer.draft.v1";

export interface ComposerDraft<L = unknown> {
  layers: L[];
  /** The library make-up being edited, if any. */
  open: { id: string; revision: number; name: string } | null;
}

export function readComposerDraft<L>(): ComposerDraft<L> | null {
  if (typeof localStorage === "undefined") return null;
  try {
    const d = JSON.parse(localStorage.getItem(COMPOSER_DRAFT_KEY) ?? "null") as ComposerDraft<L> | null;
    return d && Array.isArray(d.layers) && d.layers.length ? d : null;
  } catch {
    return null;
  }
}

export function writeComposerDraft<L>(d: ComposerDraft<L>): void {
  try {
    localStorage.setItem(COMPOSER_DRAFT_KEY, JSON.stringify(d));
  } catch {
    /* storage full or disabled: the draft is simply not kept */
  }
}
