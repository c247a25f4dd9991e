/**
 * The example values of the API document: the demo scenario's firm, building and façades (src/lib/demo-scenario.ts),
 * with ids as placeholders that the example test (tests/e2e/api-examples.spec.ts) replaces by the ids of rows it
 * made. The glazing values in the examples are computed by the engine from the example layers, not written here.
 *
 * Pure (no I/O).
 */
import { calculateGlazing } from "@/lib/calc/glazing";
import { GlazingRequest } from "@/lib/contracts/glazing";
import { ScheduleRequest } from "@/lib/contracts/schedule";
import { scheduleResponse as scheduleResponseOf } from "@/lib/calc/schedule-response";
import { makeupDescription } from "@/lib/calc/makeup-description";
import type { MakeupValues } from "@/lib/contracts/results";
import { DEMO_ORGANIZATION, DEMO_PROJECTS, DEMO_USERS } from "@/lib/demo-scenario";

/** Placeholder ids, one per row an example names; the example test maps each to a row of its own. */
export const EXAMPLE_IDS = {
  organizationId: "0c1f5a7e-6b2d-4e3a-9d41-2f8b7c6a5e01",
  projectId: "6d2e9b14-3c5a-4f7e-8a19-0b4c2d6e8f02",
  /** A second project, the one the delete example removes. */
  otherProjectId: "a83f6c2d-1e4b-4d9a-b7c5-3e2f1a0d9c03",
  facadeId: "f4b1c8e2-7a3d-4c6b-9e52-1d0a3b7c6e04",
  makeupId: "2b7e4d1a-9c3f-4a8e-b6d2-5f1c0e9a8b05",
  /** A make-up that no option uses (the delete example). */
  otherMakeupId: "c9d2a6f3-4b1e-47c8-a5d9-8e3f2b1a0c06",
  paneId: "5e8a3c1f-2d7b-4e9c-8f46-a1b0c3d2e507",
  optionId: "9a4c7e2b-5d1f-4b8a-9c63-e2f1d0a4b708",
  /** A second option of the same façade (approved in the decision example, removed in the delete example). */
  otherOptionId: "e1f3b5d7-8c2a-4d6e-a9b4-7c0d2e1f3a09",
  /** The demo client's membership (shares, deliveries). */
  memberId: "3c6e9f2a-1b4d-4e7a-8c5f-0d2b1a3e4c10",
  /** A member whose role the role example changes and whom the removal example removes. */
  otherMemberId: "7f2a4c6e-9d1b-4a3c-b8e5-2f0c1d3b5a11",
  invitationId: "d5b7e9c1-3f2a-4c8d-9e6b-1a0f2c4d6e12",
  deliveryId: "8e1c3a5f-7b9d-4f2e-a4c6-0b1d3f5e7a13",
  userId: "4a6c8e0b-2d4f-4b6a-8c0e-2f4a6c8e0b14",
  commentId: "b2d4f6a8-0c2e-4a6c-9e0b-4d6f8a0c2e15",
  decisionId: "1e3a5c7e-9b1d-4f3a-8c5e-7a9c1e3b5d16",
  uploadId: "6f8b0d2f-4a6c-4e8a-b0c2-8d0f2a4c6e17",
  historyId: "0a2c4e6a-8c0e-4a2c-9e4a-6c8e0a2c4e18",
  /** An organisation API key (the revoke example). */
  apiKeyId: "3b5d7f9b-1d3f-4b5d-8f1b-5d7f9b1d3f19",
  /** An event of the organisation's history. */
  orgEventId: "9c1e3a5c-7e9a-4c1e-b3a5-1e3a5c7e9a20",
} as const;

export const EXAMPLE_INSTANT = "2026-11-24T10:42:17.318Z";
export const EXAMPLE_LATER = "2026-11-26T15:08:52.904Z";
export const EXAMPLE_YEAR = 2026;

const [owner, consultant, architect, client] = DEMO_USERS as [
  (typeof DEMO_USERS)[number],
  (typeof DEMO_USERS)[number],
  (typeof DEMO_USERS)[number],
  (typeof DEMO_USERS)[number],
];
export const EXAMPLE_PEOPLE = { owner, consultant, architect, client };
export const EXAMPLE_ORGANIZATION = DEMO_ORGANIZATION;
export const EXAMPLE_PROJECT = DEMO_PROJECTS[0]!;
export const EXAMPLE_FACADE = EXAMPLE_PROJECT.facades[1]!;

/** A low-e double unit with argon and a laminated inner pane (6 | 16 argon | 6.8), as POST /calc/glazing takes it. */
export const EXAMPLE_LAYERS = [
  { kind: "pane", thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.015, emissivityBack: 0.04 },
  { kind: "gap", widthMm: 16, gas: { argon: 0.9, air: 0.1 } },
  { kind: "pane", thicknessMm: 6.8, refractiveIndex: 1.52, absorptionPerMm: 0.02 },
];
/** A solar-control alternative: tinted outer pane, air. */
export const EXAMPLE_LAYERS_TINTED = [
  { kind: "pane", thicknessMm: 8, refractiveIndex: 1.52, absorptionPerMm: 0.09 },
  { kind: "gap", widthMm: 14, gas: "air" },
  { kind: "pane", thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.015, emissivityFront: 0.04 },
];

/** The values a make-up of these layers stores, computed by the engine. */
export function exampleValues(layers: unknown[]): MakeupValues {
  const res = calculateGlazing(GlazingRequest.parse({ layers, anglesDeg: [0] }));
  const { angleDeg: _angle, ...normal } = res.angles[0]!;
  void _angle;
  return { normal, hemispherical: res.hemispherical, uValue: res.uValue, warnings: res.warnings, light: res.light };
}

// ---- request bodies -------------------------------------------------------------------------------------------

const P = EXAMPLE_PROJECT;
const ID = EXAMPLE_IDS;

export const signUpBody = {
  name: "Alva Brandt",
  email: "alva.brandt@brandt-glass.example",
  password: "choose-a-long-passphrase",
  organizationName: "Brandt Glass Studio",
};
export const signUpResponse = {
  status: "verification-sent",
  message: "Check your inbox: we sent a link to confirm your e-mail address. The account can be used once it is confirmed.",
};

export const glazingBody = { layers: EXAMPLE_LAYERS, anglesDeg: [0, 30, 60] };
export const glazingResponse = () => calculateGlazing(GlazingRequest.parse(glazingBody));

export const scheduleBody = {
  site: { latitudeDeg: P.latitudeDeg, longitudeDeg: P.longitudeDeg, timeZone: P.timeZone, elevationM: P.elevationM },
  from: "2026-06-21",
  to: "2026-06-21",
  stepMinutes: 60,
  surfaces: [
    {
      name: EXAMPLE_FACADE.name,
      azimuthDeg: EXAMPLE_FACADE.azimuthDeg,
      tiltDeg: EXAMPLE_FACADE.tiltDeg,
      layers: EXAMPLE_LAYERS,
      glazedAreaM2: 184,
      shading: { window: { widthM: 1.8, heightM: 2.6 }, overhang: { depthM: 0.6, gapAboveM: 0.3 } },
    },
  ],
};
/** The engine's answer for the example body, with three of its 24 rows (around noon) kept. */
export function scheduleResponse() {
  const res = scheduleResponseOf(ScheduleRequest.parse(scheduleBody));
  return { ...res, surfaces: res.surfaces.map((s) => ({ ...s, rows: s.rows.slice(12, 15) })) };
}

export const invitationBody = { email: "lea.brandt@orla-kemp.example", role: "architect" };
export const projectCreateBody = {
  organizationId: ID.organizationId,
  name: P.name,
  reference: P.reference,
  buildingName: P.buildingName,
  siteName: P.siteName,
  latitudeDeg: P.latitudeDeg,
  longitudeDeg: P.longitudeDeg,
  timeZone: P.timeZone,
  elevationM: P.elevationM,
  description: P.description,
  facades: [{ name: EXAMPLE_FACADE.name, azimuthDeg: EXAMPLE_FACADE.azimuthDeg, tiltDeg: 90, glazedAreaM2: 184 }],
};
export const projectPatchBody = { description: "Conversion of a former rope factory into offices; stage 3 glazing review of the Ropewalk front." };
export const makeupCreateBody = {
  name: "Ropewalk low-e argon 6 | 16 | 6.8",
  layers: EXAMPLE_LAYERS,
  note: "Stage 3 proposal for the Ropewalk front",
};
export const makeupPatchBody = { revision: 1, note: "Inner pane laminated for the ground-floor safety glazing" };
export const paneCreateBody = {
  name: "Quayside clear 6 mm",
  layer: { thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.015 },
  note: "Clear float, invented sample values",
};
export const panePatchBody = { revision: 1, note: "Checked against the supplier's sample sheet" };
export const optionCreateBody = { facadeId: ID.facadeId, makeupId: ID.makeupId, name: "Solar-control tint, air" };
export const requirementsBody = {
  project: { maxGValue: 0.4, minLightTransmittance: 0.6, maxUValue: 1.3 },
  facades: { [ID.facadeId]: { maxPeakTransmittedWm2: 220 } },
  version: 0,
};
export const decisionBody = { decision: "approved", note: "Agreed with the client at the stage 3 review." };
export const revisionBody = { note: "Stage 3 glazing schedule for tender", year: EXAMPLE_YEAR };
export const deliveryBody = {
  revision: "A",
  to: ["site.office@cordage-dev.example"],
  memberIds: [ID.memberId],
  message: "Revision A of the glazing schedule for the Cordage Works, for tender.",
};

export const panesFile = {
  name: "quayside-panes.csv",
  contentType: "text/csv",
  text: [
    "name,thickness_mm,solar_t,solar_rf,solar_rb,light_t,light_rf,light_rb,emissivity_front,emissivity_back,note",
    "Quayside clear 8,8,0.77,0.071,0.071,0.88,0.08,0.08,0.837,0.837,Invented sample sheet QC-8",
    "Quayside bronze 6,6,0.49,0.058,0.061,0.5,,,0.837,0.837,Tinted body glass; light reflectances not measured",
    "",
  ].join("\n"),
};
/** Six hours of the summer solstice at the Cordage Works (local times of Europe/Lisbon); invented values. */
export const weatherFile = {
  name: "cordage-quay-june.csv",
  contentType: "text/csv",
  text: [
    "time,ghi_wm2,dni_wm2,dhi_wm2,air_temperature_c",
    "2026-06-21 10:00,712,788,118,24.1",
    "2026-06-21 11:00,846,836,124,25.6",
    "2026-06-21 12:00,921,858,129,26.8",
    "2026-06-21 13:00,930,860,131,27.5",
    "2026-06-21 14:00,872,842,127,27.9",
    "2026-06-21 15:00,758,802,121,27.6",
    "",
  ].join("\n"),
};

// ---- answers --------------------------------------------------------------------------------------------------

const membership = (role: "owner" | "consultant" | "architect" | "client") => ({
  memberId: ID.otherMemberId,
  organizationId: ID.organizationId,
  organizationName: EXAMPLE_ORGANIZATION.name,
  organizationSlug: EXAMPLE_ORGANIZATION.slug,
  role,
});
export const meResponse = { user: { id: ID.userId, name: consultant.name, email: consultant.email }, memberships: [membership("consultant")] };

export const invitationSummary = (status: "pending" | "accepted") => ({
  id: ID.invitationId,
  email: architect.email,
  role: "architect",
  organizationId: ID.organizationId,
  organizationName: EXAMPLE_ORGANIZATION.name,
  inviterName: owner.name,
  status,
  expiresAt: "2026-12-01T10:42:17.318Z",
});
export const invitationEntry = {
  id: ID.invitationId,
  email: invitationBody.email,
  role: "architect",
  status: "pending",
  expiresAt: "2026-12-01T10:42:17.318Z",
  inviterName: owner.name,
};
export const invitationCreated = {
  invitation: {
    id: ID.invitationId,
    email: invitationBody.email,
    role: "architect",
    status: "pending",
    organizationId: ID.organizationId,
    expiresAt: "2026-12-01T10:42:17.318Z",
    inviterId: ID.userId,
  },
  invitations: [invitationEntry],
};
const member = (who: (typeof DEMO_USERS)[number], memberId: string, role: string) => ({
  memberId,
  userId: ID.userId,
  name: who.name,
  email: who.email,
  role,
  joinedAt: EXAMPLE_INSTANT,
});
export const membersPage = {
  members: [member(owner, ID.otherMemberId, "owner"), member(client, ID.memberId, "client")],
  nextCursor: null,
  invitations: [invitationEntry],
  invitationsNextCursor: null,
};
export const memberList = (otherRole: string | null) => ({
  members: [
    member(owner, ID.organizationId, "owner"),
    ...(otherRole ? [member(consultant, ID.otherMemberId, otherRole)] : []),
    member(client, ID.memberId, "client"),
  ],
});

export const project = (id: string) => ({
  id,
  organizationId: ID.organizationId,
  name: P.name,
  reference: P.reference,
  buildingName: P.buildingName,
  siteName: P.siteName,
  latitudeDeg: P.latitudeDeg,
  longitudeDeg: P.longitudeDeg,
  timeZone: P.timeZone,
  elevationM: P.elevationM,
  groundAlbedo: 0.2,
  skyModel: "perez",
  linkeTurbidity: null,
  description: P.description,
  createdById: ID.userId,
  createdAt: EXAMPLE_INSTANT,
  updatedAt: EXAMPLE_INSTANT,
});
export const facade = {
  id: ID.facadeId,
  projectId: ID.projectId,
  name: EXAMPLE_FACADE.name,
  azimuthDeg: EXAMPLE_FACADE.azimuthDeg,
  tiltDeg: EXAMPLE_FACADE.tiltDeg,
  glazedAreaM2: 184,
  windowWidthM: null,
  windowHeightM: null,
  shading: null,
  position: 0,
  createdAt: EXAMPLE_INSTANT,
  updatedAt: EXAMPLE_INSTANT,
};
export const projectList = {
  nextCursor: null,
  organizations: [
    {
      organizationId: ID.organizationId,
      organizationName: EXAMPLE_ORGANIZATION.name,
      role: "consultant",
      projects: [{ ...project(ID.projectId), facadeCount: 5 }],
    },
  ],
};
export const share = (shared: boolean) => ({ memberId: ID.memberId, name: client.name, email: client.email, role: "client", shared });

export const makeup = (over: { revision?: number; note?: string } = {}) => ({
  id: ID.makeupId,
  organizationId: ID.organizationId,
  revision: over.revision ?? 1,
  latestRevision: over.revision ?? 1,
  name: makeupCreateBody.name,
  description: makeupDescription(GlazingRequest.parse({ layers: EXAMPLE_LAYERS }).layers),
  layers: EXAMPLE_LAYERS,
  note: over.note ?? makeupCreateBody.note,
  values: exampleValues(EXAMPLE_LAYERS),
  createdBy: consultant.name,
  createdAt: EXAMPLE_INSTANT,
  updatedAt: over.revision ? EXAMPLE_LATER : EXAMPLE_INSTANT,
});
export const makeupDetail = {
  ...makeup(),
  revisions: [{ revision: 1, name: makeupCreateBody.name, createdBy: consultant.name, createdAt: EXAMPLE_INSTANT }],
  usedBy: [{ optionName: "Low-e argon", projectName: P.name, facadeName: EXAMPLE_FACADE.name }],
};
export const pane = (over: { revision?: number; note?: string } = {}) => ({
  id: ID.paneId,
  organizationId: ID.organizationId,
  revision: over.revision ?? 1,
  latestRevision: over.revision ?? 1,
  name: paneCreateBody.name,
  description: "6 mm",
  layer: { kind: "pane", ...paneCreateBody.layer },
  note: over.note ?? paneCreateBody.note,
  createdBy: consultant.name,
  createdAt: EXAMPLE_INSTANT,
  updatedAt: over.revision ? EXAMPLE_LATER : EXAMPLE_INSTANT,
});

export const option = (over: { id?: string; name?: string; version?: number } = {}) => ({
  id: over.id ?? ID.optionId,
  projectId: ID.projectId,
  facadeId: ID.facadeId,
  name: over.name ?? "Low-e argon",
  position: 0,
  status: "proposed",
  version: over.version ?? 1,
  makeupId: ID.makeupId,
  makeupName: makeupCreateBody.name,
  makeupRevision: 1,
  latestMakeupRevision: 1,
  description: makeup().description,
  layers: EXAMPLE_LAYERS,
  values: exampleValues(EXAMPLE_LAYERS),
  createdAt: EXAMPLE_INSTANT,
  updatedAt: EXAMPLE_INSTANT,
});

export const requirements = (version: number) => ({
  project: requirementsBody.project,
  facades: requirementsBody.facades,
  version,
  updatedAt: EXAMPLE_LATER,
});
export const comment = {
  id: ID.commentId,
  optionId: ID.optionId,
  parentId: null,
  author: { id: ID.userId, name: architect.name },
  body: "Can we keep the light transmittance above 0.6 on the Ropewalk front? The ground-floor studios face it.",
  createdAt: EXAMPLE_INSTANT,
};
export const decisionResponse = {
  option: { id: ID.otherOptionId, facadeId: ID.facadeId, name: "Solar-control tint, air", status: "approved", version: 2 },
  decisions: [
    { id: ID.decisionId, optionId: ID.otherOptionId, decision: "approved", note: decisionBody.note, decidedBy: architect.name, at: EXAMPLE_LATER },
  ],
};
export const history = {
  items: [
    {
      id: ID.historyId,
      kind: "option.created",
      summary: `Added option “Low-e argon” (${makeupCreateBody.name}, revision 1) to ${EXAMPLE_FACADE.name}`,
      actor: consultant.name,
      at: EXAMPLE_INSTANT,
      detail: { optionId: ID.optionId, facadeId: ID.facadeId },
    },
  ],
  nextCursor: null,
};

const flags = [
  { requirement: "maxGValue", limit: 0.4, value: 0.38, status: "pass", margin: 0.02 },
  { requirement: "maxUValue", limit: 1.3, value: 1.1, status: "pass", margin: 0.2 },
];
const optionYear = {
  annual: { transmittedKWhm2: 212.4, solarGainKWhm2: 268.9 },
  peak: { transmittedWm2: 301.7, at: "2026-09-14T16:30:00+01:00" },
  monthly: {
    transmittedKWhm2: [9.8, 12.1, 16.9, 19.4, 22.6, 23.9, 25.1, 24.2, 20.3, 16.1, 11.4, 10.6],
    solarGainKWhm2: [12.6, 15.5, 21.4, 24.6, 28.6, 30.2, 31.8, 30.7, 25.7, 20.4, 14.6, 13.8],
  },
};
const siteSnapshot = {
  name: P.siteName,
  latitudeDeg: P.latitudeDeg,
  longitudeDeg: P.longitudeDeg,
  timeZone: P.timeZone,
  elevationM: P.elevationM,
  groundAlbedo: 0.2,
  skyModel: "perez",
  linkeTurbidity: null,
};
const optionResult = () => ({
  optionId: ID.optionId,
  name: "Low-e argon",
  status: "approved",
  makeupId: ID.makeupId,
  makeupRevision: 1,
  makeupName: makeupCreateBody.name,
  description: makeup().description,
  values: exampleValues(EXAMPLE_LAYERS),
  ...optionYear,
  flags,
  inputsKey: "5d1c0f3e9a7b2c4d6e8f0a1b3c5d7e9f1a2b4c6d8e0f2a4b6c8d0e2f4a6b8c0d",
});
export const resultsResponse = () => ({
  projectId: ID.projectId,
  year: EXAMPLE_YEAR,
  inputsKey: "9e7c5a3f1d2b4c6e8a0b2d4f6a8c0e2b4d6f8a0c2e4b6d8f0a2c4e6b8d0f2a4c",
  computedAt: EXAMPLE_LATER,
  facades: [
    {
      facadeId: ID.facadeId,
      name: EXAMPLE_FACADE.name,
      azimuthDeg: EXAMPLE_FACADE.azimuthDeg,
      tiltDeg: EXAMPLE_FACADE.tiltDeg,
      glazedAreaM2: 184,
      limits: { maxGValue: 0.4, maxUValue: 1.3 },
      options: [optionResult()],
      shading: null,
    },
  ],
  site: siteSnapshot,
  cache: { hits: 0, misses: 1 },
  irradiance: { source: "clear sky" },
});
export const compareResponse = () => {
  const angles = calculateGlazing(GlazingRequest.parse({ layers: EXAMPLE_LAYERS, anglesDeg: [0, 45] })).angles;
  const one = (optionId: string, name: string) => ({
    ...optionResult(),
    optionId,
    name,
    facadeId: ID.facadeId,
    facadeName: EXAMPLE_FACADE.name,
    angles,
    surface: { name: EXAMPLE_FACADE.name, azimuthDeg: EXAMPLE_FACADE.azimuthDeg, tiltDeg: EXAMPLE_FACADE.tiltDeg, layers: EXAMPLE_LAYERS },
  });
  return {
    projectId: ID.projectId,
    year: EXAMPLE_YEAR,
    inputsKey: "2a4c6e8a0c2e4a6c8e0a2c4e6a8c0e2a4c6e8a0c2e4a6c8e0a2c4e6a8c0e2a4c",
    site: siteSnapshot,
    irradiance: { source: "clear sky" },
    options: [one(ID.optionId, "Low-e argon"), one(ID.otherOptionId, "Solar-control tint, air")],
  };
};
export const revisionResponse = () => {
  const facades = [
    {
      facadeId: ID.facadeId,
      facadeName: EXAMPLE_FACADE.name,
      azimuthDeg: EXAMPLE_FACADE.azimuthDeg,
      tiltDeg: EXAMPLE_FACADE.tiltDeg,
      optionId: ID.optionId,
      optionName: "Low-e argon",
      makeupId: ID.makeupId,
      makeupRevision: 1,
      makeupName: makeupCreateBody.name,
      description: makeup().description,
      layers: EXAMPLE_LAYERS,
      values: exampleValues(EXAMPLE_LAYERS),
      ...optionYear,
      flags,
      glazedAreaM2: 184,
      shading: null,
    },
  ];
  return {
    revision: "A",
    sequence: 1,
    note: revisionBody.note,
    issuedAt: EXAMPLE_LATER,
    issuedBy: consultant.name,
    facades,
    snapshot: { year: EXAMPLE_YEAR, site: siteSnapshot, facades, irradiance: { source: "clear sky" }, unapproved: [] },
    unapproved: [],
  };
};

const upload = (fileName: string, sizeBytes: number, rowCount: number) => ({
  id: ID.uploadId,
  fileName,
  sizeBytes,
  sha256: "3b0f6d2a8c4e1f7a9b5d3c0e2f4a6b8d0c2e4f6a8b0d2c4e6f8a0b2d4c6e8f0a",
  rowCount,
  createdAt: EXAMPLE_INSTANT,
  createdBy: consultant.name,
});
export const paneImport = {
  panes: [
    {
      ...pane(),
      name: "Quayside clear 8",
      description: "8 mm",
      layer: {
        kind: "pane",
        thicknessMm: 8,
        emissivityFront: 0.837,
        emissivityBack: 0.837,
        measured: {
          solarTransmittance: 0.77,
          solarReflectanceFront: 0.071,
          solarReflectanceBack: 0.071,
          visibleTransmittance: 0.88,
          visibleReflectanceFront: 0.08,
          visibleReflectanceBack: 0.08,
        },
      },
      note: "Invented sample sheet QC-8",
    },
  ],
  upload: upload(panesFile.name, panesFile.text.length, 2),
  sha256: "3b0f6d2a8c4e1f7a9b5d3c0e2f4a6b8d0c2e4f6a8b0d2c4e6f8a0b2d4c6e8f0a",
};
export const weatherSummary = {
  from: "2026-06-21T09:00:00.000Z",
  to: "2026-06-21T14:00:00.000Z",
  fromDate: "2026-06-21",
  toDate: "2026-06-21",
  hours: 6,
  stepMinutes: 60,
  airTemperatureHours: 6,
  sha256: "3b0f6d2a8c4e1f7a9b5d3c0e2f4a6b8d0c2e4f6a8b0d2c4e6f8a0b2d4c6e8f0a",
  upload: upload(weatherFile.name, weatherFile.text.length, 6),
};
export const weatherCreated = {
  from: weatherSummary.from,
  to: weatherSummary.to,
  hours: 6,
  sha256: weatherSummary.sha256,
  weather: weatherSummary,
};

export const delivery = (status: "queued" | "sent") => ({
  id: ID.deliveryId,
  projectId: ID.projectId,
  revision: "A",
  recipients: [{ email: "site.office@cordage-dev.example" }, { email: client.email, name: client.name, memberId: ID.memberId }],
  message: deliveryBody.message,
  status,
  attempts: status === "sent" ? 1 : 0,
  lastError: null,
  createdAt: EXAMPLE_INSTANT,
  createdBy: consultant.name,
  sentAt: status === "sent" ? EXAMPLE_LATER : null,
  messageId: status === "sent" ? "<0f3c9e1a-7b2d-4c5e-8f6a-2d4b6c8e0a1f@halden-facades.example>" : null,
  attachment: status === "sent" ? { fileName: "HFP-2026-014 glazing schedule rev A.xlsx", sha256: weatherSummary.sha256, sizeBytes: 48213 } : null,
});

// ---- organisation API keys and history ---------------------------------------------------------------------------

export const apiKeyBody = { name: "Tender schedule export", scope: "read" } as const;
/** A key as the list shows it (never the key itself). */
export const apiKeyEntry = (revokedAt: string | null = null) => ({
  id: ID.apiKeyId,
  name: apiKeyBody.name,
  scope: apiKeyBody.scope,
  start: "pnr_7Qd2xK",
  createdByName: owner.name,
  createdAt: "2026-11-30T08:15:02.114Z",
  lastUsedAt: "2026-12-01T06:00:41.902Z",
  revokedAt,
});
export const apiKeyCreated = {
  apiKey: { ...apiKeyEntry(), lastUsedAt: null },
  key: "pnr_7Qd2xKv0mW3bS9eT1yHc4nJ6pL8rA5uZ2fG0iOqXk",
};
export const apiKeyList = { apiKeys: [apiKeyEntry()], nextCursor: null };
export const apiKeyRevoked = { apiKey: apiKeyEntry("2026-12-02T09:30:12.551Z") };
export const orgHistory = {
  events: [
    {
      id: ID.orgEventId,
      kind: "api-key.created",
      summary: `Created the API key “${apiKeyBody.name}” (${apiKeyBody.scope})`,
      actorName: owner.name,
      createdAt: "2026-11-30T08:15:02.114Z",
    },
  ],
  nextCursor: null,
};
