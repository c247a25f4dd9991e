/**
 * The registry of the validation report: every domain of reference cases with its title, its cases and the one
 * evaluator that both the reference tests and the report run. A case module's cases reach the page and the
 * tests only through this list (tests/reference/validation-registry.test.ts fails for a case module or case
 * left out).
 */
import { absorbingPaneDomain } from "@/lib/reference-cases/absorbing-pane";
import { fresnelDomain } from "@/lib/reference-cases/fresnel";
import { gValueDomain } from "@/lib/reference-cases/g-value";
import { gasPropertiesDomain } from "@/lib/reference-cases/gas-properties";
import { hemisphericalDomain } from "@/lib/reference-cases/hemispherical";
import { incidence } from "@/lib/reference-cases/incidence";
import { irradiance } from "@/lib/reference-cases/irradiance";
import { layerStackDomain } from "@/lib/reference-cases/layer-stack";
import { lightTransmittanceDomain } from "@/lib/reference-cases/light-transmittance";
import { localTimeline } from "@/lib/reference-cases/local-timeline";
import { measuredPaneDomain } from "@/lib/reference-cases/measured-pane";
import { shading } from "@/lib/reference-cases/shading";
import { shadingDiffuse } from "@/lib/reference-cases/shading-diffuse";
import { sunPosition } from "@/lib/reference-cases/sun-position";
import { uValueDomain } from "@/lib/reference-cases/u-value";
import type { ReferenceCase } from "@/lib/reference-cases/types";
import { evaluateAbsorbingPane } from "./engines/absorbing-pane";
import { evaluateFresnel } from "./engines/fresnel";
import { evaluateGasProperties } from "./engines/gas-properties";
import { evaluateGValue } from "./engines/g-value";
import { evaluateHemispherical } from "./engines/hemispherical";
import { evaluateIncidence } from "./engines/incidence";
import { evaluateIrradiance } from "./engines/irradiance";
import { evaluateLayerStack } from "./engines/layer-stack";
import { evaluateLightTransmittance } from "./engines/light-transmittance";
import { evaluateLocalTimeline, expectedTimelineTexts } from "./engines/local-timeline";
import { evaluateMeasuredPane } from "./engines/measured-pane";
import { evaluateShading } from "./engines/shading";
import { evaluateShadingDiffuse } from "./engines/shading-diffuse";
import { evaluateSunPosition } from "./engines/sun-position";
import { evaluateUValue } from "./engines/u-value";
import { defineDomain, type Evaluation, type ValidationDomain } from "./types";

const of = <C extends ReferenceCase>(
  label: string,
  d: { readonly domain: string; readonly title: string; readonly cases: readonly C[] },
  evaluate: (c: C) => Evaluation,
) => defineDomain({ domain: d.domain, title: d.title, label, cases: d.cases, evaluate });

/** Every domain, in the order the report shows them. */
export const VALIDATION_DOMAINS: readonly ValidationDomain[] = [
  of("Fresnel", fresnelDomain, evaluateFresnel),
  of("Absorbing pane", absorbingPaneDomain, evaluateAbsorbingPane),
  of("Measured panes", measuredPaneDomain, evaluateMeasuredPane),
  of("Layer stacks", layerStackDomain, evaluateLayerStack),
  of("Hemispherical", hemisphericalDomain, evaluateHemispherical),
  of("Light transmittance", lightTransmittanceDomain, evaluateLightTransmittance),
  of("g (EN 410)", gValueDomain, evaluateGValue),
  of("U (EN 673)", uValueDomain, evaluateUValue),
  of("Gas properties", gasPropertiesDomain, evaluateGasProperties),
  of("Sun position", sunPosition, evaluateSunPosition),
  of("Incidence", incidence, evaluateIncidence),
  of("Shading (beam)", shading, evaluateShading),
  of("Shading (diffuse)", shadingDiffuse, evaluateShadingDiffuse),
  of("Sky and transposition", irradiance, evaluateIrradiance),
  defineDomain({ ...localTimeline, label: "Daylight saving", evaluate: evaluateLocalTimeline, expectedTexts: expectedTimelineTexts }),
];

/** The registry's domain of a key; throws for an unknown key. */
export function validationDomain(key: string): ValidationDomain {
  const d = VALIDATION_DOMAINS.find((x) => x.domain === key);
  if (!d) throw new Error(`no validation domain ${key}`);
  return d;
}

/**
 * The libraries the evaluators use as references (their versions go into the report): the general-purpose
 * astronomy library behind the year comparisons and transits, and the solar-position library the engine wraps,
 * whose own output is a recorded check value.
 */
export const REFERENCE_LIBRARIES = ["astronomy-engine", "suncalc"] as const;
