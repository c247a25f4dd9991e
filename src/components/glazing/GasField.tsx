import type { Gas } from "@/lib/contracts/glazing";

const NAMES = ["air", "argon", "krypton"] as const;
type Name = (typeof NAMES)[number];

/** Main gas and fill fraction (the rest air) ⇄ the request's gas value. */
export function splitGas(gas: Gas | undefined): { name: Name; fillPercent: number } {
  if (!gas || typeof gas === "string") return { name: (gas as Name) ?? "air", fillPercent: 100 };
  const main = (["krypton", "argon"] as const).find((g) => (gas[g] ?? 0) > 0) ?? "air";
  return { name: main, fillPercent: Math.round((main === "air" ? 1 : (gas[main] ?? 0)) * 1000) / 10 };
}

export function joinGas(name: Name, fillPercent: number): Gas {
  if (name === "air" || fillPercent >= 100) return name;
  const f = Math.max(0, Math.min(100, fillPercent)) / 100;
  return { [name]: f, air: Math.round((1 - f) * 1e6) / 1e6 } as Gas;
}

export default function GasField({ id, value, onChange }: { id: string; value: Gas | undefined; onChange: (g: Gas) => void }) {
  const { name, fillPercent } = splitGas(value);
  return (
    <div className="grid grid-cols-[1fr_90px] gap-2">
      <div>
        <label htmlFor={`${id}-gas`}>Gas</label>
        <select id={`${id}-gas`} value={name} onChange={(e) => onChange(joinGas(e.target.value as Name, e.target.value === "air" ? 100 : 90))}>
          {NAMES.map((n) => (
            <option key={n} value={n}>
              {n}
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor={`${id}-fill`}>Fill %</label>
        <input
          id={`${id}-fill`}
          type="number"
          min={0}
          max={100}
          step={1}
          disabled={name === "air"}
          value={name === "air" ? 100 : fillPercent}
          onChange={(e) => onChange(joinGas(name, e.target.valueAsNumber))}
        />
      </div>
    </div>
  );
}
