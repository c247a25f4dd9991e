/**
 * The demo scenario: an invented façade consultancy, its people and one building.
 * Every name here is made up; the site coordinates are a plausible waterfront plot.
 * Used by the demo seed (scripts/seed.ts) and by the end-to-end tests.
 */
import type { RoleName } from "./auth/roles";

export const DEMO_PASSWORD = "paneray-demo-2026";

export const DEMO_ORGANIZATION = { name: "Halden Façade Partners", slug: "halden-facade-partners" } as const;

export const DEMO_USERS: readonly { role: RoleName; name: string; email: string }[] = [
  { role: "owner", name: "Ines Halden", email: "ines.halden@halden-facades.example" },
  { role: "consultant", name: "Tomas Reis", email: "tomas.reis@halden-facades.example" },
  { role: "architect", name: "Mara Okafor", email: "mara.okafor@orla-kemp.example" },
  { role: "client", name: "Jonah Pell", email: "jonah.pell@cordage-dev.example" },
];

export const demoUser = (role: RoleName) => DEMO_USERS.find((u) => u.role === role)!;

export const DEMO_PROJECTS = [
  {
    name: "Cordage Works refurbishment",
    reference: "HFP-2026-014",
    buildingName: "The Cordage Works",
    siteName: "Cordage Quay, plot 7",
    latitudeDeg: 38.7053,
    longitudeDeg: -9.1721,
    timeZone: "Europe/Lisbon",
    elevationM: 12,
    description: "Conversion of a former rope factory into offices: new glazing to the four street façades and a sawtooth roof light.",
    sharedWithClient: true,
    facades: [
      { name: "Quay front (south-east)", azimuthDeg: 135, tiltDeg: 90 },
      { name: "Ropewalk (south-west)", azimuthDeg: 225, tiltDeg: 90 },
      { name: "Yard (north-west)", azimuthDeg: 315, tiltDeg: 90 },
      { name: "Warehouse lane (north-east)", azimuthDeg: 45, tiltDeg: 90 },
      { name: "Sawtooth roof light", azimuthDeg: 0, tiltDeg: 60 },
    ],
  },
  {
    name: "Linden Yard studio block",
    reference: "HFP-2026-021",
    buildingName: "Linden Yard, block C",
    siteName: "Linden Yard",
    latitudeDeg: 52.3702,
    longitudeDeg: 4.8952,
    timeZone: "Europe/Amsterdam",
    elevationM: 2,
    description: "Early-stage study: curtain wall options for a small studio block (not yet shared with the client).",
    sharedWithClient: false,
    facades: [
      { name: "Courtyard (south)", azimuthDeg: 180, tiltDeg: 90 },
      { name: "Street (north)", azimuthDeg: 0, tiltDeg: 90 },
    ],
  },
] as const;

/**
 * The demo firm's glazing library: invented make-ups. Clear float is described by glass properties
 * (n = 1.52, absorption 0.02 /mm: common practice, no source); the coated panes carry invented data-sheet
 * values, as a consultant would type them from a maker's sheet.
 */
const clearFloat = (thicknessMm: number) => ({ kind: "pane", thicknessMm, refractiveIndex: 1.52, absorptionPerMm: 0.02 });
const clearMeasured = (thicknessMm: number) => ({
  kind: "pane",
  thicknessMm,
  measured: {
    solarTransmittance: 0.8,
    solarReflectanceFront: 0.07,
    solarReflectanceBack: 0.07,
    visibleTransmittance: 0.89,
    visibleReflectanceFront: 0.08,
    visibleReflectanceBack: 0.08,
  },
});

export const DEMO_MAKEUPS = [
  {
    key: "clear",
    name: "Clear double 6 | 16 air | 6",
    note: "Uncoated float both panes; the reference option.",
    layers: [clearFloat(6), { kind: "gap", widthMm: 16, gas: "air" }, clearFloat(6)],
  },
  {
    key: "solar",
    name: "Solar-control double, argon",
    note: "Outer pane: Halden sample sheet SC-40/6 (invented).",
    layers: [
      {
        kind: "pane",
        thicknessMm: 6,
        emissivityBack: 0.04,
        measured: {
          solarTransmittance: 0.38,
          solarReflectanceFront: 0.33,
          solarReflectanceBack: 0.3,
          visibleTransmittance: 0.62,
          visibleReflectanceFront: 0.12,
          visibleReflectanceBack: 0.14,
        },
      },
      { kind: "gap", widthMm: 16, gas: { argon: 0.9, air: 0.1 } },
      clearMeasured(6),
    ],
  },
  {
    key: "lowe",
    name: "Low-e double, argon",
    note: "Inner pane: Halden sample sheet LE-70/4 (invented).",
    layers: [
      clearMeasured(6),
      { kind: "gap", widthMm: 16, gas: { argon: 0.9, air: 0.1 } },
      {
        kind: "pane",
        thicknessMm: 4,
        emissivityFront: 0.03,
        measured: {
          solarTransmittance: 0.55,
          solarReflectanceFront: 0.25,
          solarReflectanceBack: 0.28,
          visibleTransmittance: 0.82,
          visibleReflectanceFront: 0.06,
          visibleReflectanceBack: 0.07,
        },
      },
    ],
  },
] as const;

/**
 * The Cordage Works study as it stands in the demo: two options on three of its façades, the brief's limits,
 * the architect's comments and approvals, and revision A issued by the consultant.
 */
export const DEMO_WORKSPACE = {
  project: "Cordage Works refurbishment",
  year: 2026,
  requirements: {
    project: { maxGValue: 0.5, minLightTransmittance: 0.5, maxUValue: 1.8 },
    facades: { "Quay front (south-east)": { maxGValue: 0.4 } },
  },
  options: [
    { facade: "Quay front (south-east)", name: "A: solar control", makeup: "solar", approve: true },
    { facade: "Quay front (south-east)", name: "B: low-e", makeup: "lowe", approve: false },
    { facade: "Ropewalk (south-west)", name: "A: solar control", makeup: "solar", approve: false },
    { facade: "Ropewalk (south-west)", name: "B: low-e", makeup: "lowe", approve: true },
    { facade: "Yard (north-west)", name: "A: clear", makeup: "clear", approve: false },
    { facade: "Yard (north-west)", name: "B: low-e", makeup: "lowe", approve: true },
  ],
  comments: [
    {
      facade: "Quay front (south-east)",
      option: "A: solar control",
      architect: "From the quay the outer reflectance may read as a mirror in the morning sun. Is there a less reflective coating with the same g?",
      reply:
        "The sheet gives 12 % light reflectance outside; the next coating down doubles the peak gain on this façade. I suggest we keep A and review a sample.",
    },
  ],
  revisionNote: "Issued for the design team's stage review.",
} as const;
