/** The entries of docs/api-changelog.md: each `## version — date` heading with its list items (joined lines). Pure. */
export function changelogEntries(markdown: string): { heading: string; items: string[] }[] {
  const out: { heading: string; items: string[] }[] = [];
  for (const line of markdown.split(/\r?\n/)) {
    if (line.startsWith("## ")) out.push({ heading: line.slice(3).trim(), items: [] });
    else if (!out.length) continue;
    else if (line.startsWith("- ")) out.at(-1)!.items.push(line.slice(2).trim());
    else if (/^\s+\S/.test(line) && out.at(-1)!.items.length) out.at(-1)!.items.push(`${out.at(-1)!.items.pop()} ${line.trim()}`);
  }
  return out;
}
