import type { RequirementFlag } from "@/lib/contracts/requirements";
import { flagText, flagTitle } from "./format";

const STYLE = {
  pass: "border-glass/40 bg-glass-light text-glass",
  fail: "border-alert/50 bg-white text-alert",
  unknown: "border-line bg-paper text-slate",
} as const;
const MARK = { pass: "✓", fail: "✗", unknown: "?" } as const;

/** Each requirement's pass / fail / unknown with its margin, in words (not colour alone). */
export default function FlagChips({ flags }: { flags: RequirementFlag[] }) {
  if (flags.length === 0) return <span className="text-xs text-slate">no limits set</span>;
  return (
    <ul className="flex min-w-[20rem] flex-wrap gap-1">
      {flags.map((f) => (
        <li
          key={f.requirement}
          title={flagTitle(f)}
          className={`rounded border px-1.5 py-0.5 text-xs ${STYLE[f.status]}`}
          data-flag={f.requirement}
          data-status={f.status}
        >
          <span aria-hidden="true">{MARK[f.status]} </span>
          {flagText(f)}
        </li>
      ))}
    </ul>
  );
}
