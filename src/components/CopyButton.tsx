import { useState } from "react";
import { useHydrated } from "./forms/useHydrated";

/** Copies the text of the code block with id `target` to the clipboard; disabled until the island is live, so a click is never lost. */
export default function CopyButton({ target, label }: { target: string; label: string }) {
  const [done, setDone] = useState<"idle" | "copied" | "failed">("idle");
  const live = useHydrated();
  const copy = async () => {
    const text = document.getElementById(target)?.textContent ?? "";
    try {
      await navigator.clipboard.writeText(text);
      setDone("copied");
    } catch {
      setDone("failed");
    }
    setTimeout(() => setDone("idle"), 2000);
  };
  return (
    <button type="button" className="btn-quiet px-2 py-1 text-xs" onClick={copy} disabled={!live} aria-label={`Copy the ${label}`} data-testid="copy">
      {done === "copied" ? "Copied" : done === "failed" ? "Select and copy" : "Copy"}
    </button>
  );
}
