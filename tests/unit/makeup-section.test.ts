// The make-up drawn in section: layers to scale (widths proportional to millimetres), low-e faces marked on
// the right face number counted from outdoors, and the generated description in the trade's notation.
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import MakeupSection from "@/components/glazing/MakeupSection";
import { makeupDescription } from "@/lib/calc/makeup-description";
import { GlazingRequest } from "@/lib/contracts/glazing";

const clear = (thicknessMm: number) => ({ kind: "pane", thicknessMm, refractiveIndex: 1.52, absorptionPerMm: 0.02 });
const layers = [clear(6), { kind: "gap", widthMm: 16, gas: { argon: 0.9, air: 0.1 } }, { ...clear(4), emissivityFront: 0.03 }];

function widths(html: string): number[] {
  return [...html.matchAll(/<g data-layer="\d+"[^>]*><rect x="[\d.]+" y="[\d.]+" width="([\d.]+)"/g)].map((m) => Number(m[1]));
}

describe("the make-up in section", () => {
  it("draws every layer to scale", () => {
    const html = renderToStaticMarkup(createElement(MakeupSection, { layers }));
    const [pane1, gap, pane2] = widths(html);
    expect(gap! / pane1!).toBeCloseTo(16 / 6, 9);
    expect(pane1! / pane2!).toBeCloseTo(6 / 4, 9);
  });

  it("marks a low-e coating on its face, numbered from outdoors", () => {
    const html = renderToStaticMarkup(createElement(MakeupSection, { layers }));
    expect(html).toContain('data-coating="3"');
    expect(html).not.toContain('data-coating="2"');
    expect(html).toContain("16 Ar 90%");
  });

  it("describes the make-up in the trade's notation (common practice, no source)", () => {
    const parsed = GlazingRequest.parse({ layers }).layers;
    expect(makeupDescription(parsed)).toBe("6 | 16 Ar 90% | 4 low-e #3");
    const triple = GlazingRequest.parse({
      layers: [
        clear(4),
        { kind: "gap", widthMm: 12, gas: "krypton" },
        clear(4),
        { kind: "gap", widthMm: 12, gas: "air" },
        { ...clear(4), emissivityBack: 0.05 },
      ],
    }).layers;
    expect(makeupDescription(triple)).toBe("4 | 12 Kr | 4 | 12 air | 4 low-e #6");
  });
});
