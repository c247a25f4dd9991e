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
