/**
 * The glazing schema's messages in the composer's words: the endpoint names fields by their keys
 * ("thicknessMm must be at least 0.5 and at most 60"); the form says "Thickness (mm) must be …",
 * and the list of problems above the inspector says which layer ("Pane 2: …", "Gap 1: …").
 */

/** Key → the words of its label, longest keys first so that one key never eats part of another. */
const WORDS: readonly [string, string][] = [
  ["visibleReflectanceFront", "light reflectance of the outer face"],
  ["visibleReflectanceBack", "light reflectance of the room-side face"],
  ["visibleTransmittance", "light transmittance"],
  ["solarReflectanceFront", "solar reflectance of the outer face"],
  ["solarReflectanceBack", "solar reflectance of the room-side face"],
  ["solarTransmittance", "solar transmittance"],
  ["refractiveIndex and absorptionPerMm", "glass properties"],
  ["refractiveIndex", "refractive index"],
  ["absorptionPerMm", "absorption (1/mm)"],
  ["emissivityFront", "emissivity of the outer face"],
  ["emissivityBack", "emissivity of the room-side face"],
  ["thicknessMm", "thickness (mm)"],
  ["widthMm", "gap width (mm)"],
];

const capitalise = (s: string) => (s ? s[0]!.toUpperCase() + s.slice(1) : s);

/** A schema message with every field key replaced by its words, starting with a capital. */
export function glazingMessageInWords(message: string): string {
  let out = message;
  for (const [key, words] of WORDS) out = out.split(key).join(words);
  return capitalise(out);
}

/** "Pane 2" or "Gap 1" for the layer at `index` (layers alternate pane, gap, pane, … from outdoors). */
export function layerName(index: number): string {
  return index % 2 === 0 ? `Pane ${index / 2 + 1}` : `Gap ${(index + 1) / 2}`;
}
