/**
 * The operations of the public API: one entry per row of the route table under /api/v1 (method + path), with
 * what the API document (./openapi.ts) and the reference page (/docs/api) say about it — summary, description,
 * group, request and response schemas, extra error statuses and an example request with its answer.
 * tests/unit/api-docs.test.ts fails when a route has no entry here, when an entry's status differs from its
 * row's `ok`, or when an example does not fit its schemas; tests/e2e/api-examples.spec.ts sends every example.
 *
 * Pure (no I/O).
 */
import { z } from "@/lib/contracts/zod";
import type { RouteMethod } from "@/lib/auth/route-table";
import { InstantPageQuery, TextPageQuery } from "@/lib/contracts/pagination";
import {
  InvitationCreatedResponse,
  InvitationListResponse,
  InvitationRequest,
  InvitationsPageResponse,
  InvitationSummaryResponse,
  MeResponse,
  MemberListResponse,
  MemberRoleRequest,
  MembersPageResponse,
  SignUpRequest,
  SignUpResponse,
} from "@/lib/contracts/auth";
import { GlazingRequest, GlazingResponse } from "@/lib/contracts/glazing";
import { ScheduleRequest, ScheduleResponse } from "@/lib/contracts/schedule";
import {
  ProjectCreatedResponse,
  ProjectCreateRequest,
  ProjectListQuery,
  ProjectListResponse,
  ProjectResponse,
  ProjectUpdatedResponse,
  ProjectUpdateRequest,
  ShareListResponse,
  ShareRequest,
  SharesPageResponse,
} from "@/lib/contracts/projects";
import {
  MakeupCreateRequest,
  MakeupDetailResponse,
  MakeupEntry,
  MakeupPageResponse,
  MakeupPatchRequest,
  MakeupRevisionQuery,
  PaneCreateRequest,
  PaneEntry,
  PaneImportResponse,
  PanePageResponse,
  PanePatchRequest,
} from "@/lib/contracts/library";
import { OptionCreatedResponse, OptionCreateRequest, OptionListResponse, OptionPatchRequest, OptionUpdatedResponse } from "@/lib/contracts/options";
import { RequirementsRequest, RequirementsResponse } from "@/lib/contracts/requirements";
import { CommentRequest, CommentsResponse, CommentView, DecisionRequest, DecisionResponse, HistoryResponse } from "@/lib/contracts/review";
import { CompareQuery, ResultsQuery, RevisionIssueRequest } from "@/lib/contracts/revisions";
import { CompareResponse, ResultsResponse, RevisionListResponse, RevisionResponse } from "@/lib/contracts/results";
import { WorkbookCsvQuery, WorkbookQuery } from "@/lib/contracts/workbook";
import { DeliveryCreatedResponse, DeliveryPageResponse, DeliveryRequest, DeliveryStatusResponse } from "@/lib/contracts/deliveries";
import {
  MAX_PANE_ROWS,
  MAX_WEATHER_ROWS,
  PANE_COLUMNS,
  PANE_REQUIRED_COLUMNS,
  WEATHER_COLUMNS,
  WEATHER_REQUIRED_COLUMNS,
  WeatherCreatedResponse,
  WeatherResponse,
} from "@/lib/contracts/uploads";
import {
  ApiKeyCreatedResponse,
  ApiKeyCreateRequest,
  ApiKeyListResponse,
  ApiKeyRevokedResponse,
  OrganizationHistoryResponse,
} from "@/lib/contracts/api-keys";
import * as ex from "./examples";
import { API_DOCUMENT_VERSION } from "./version";

/** The outline of an OpenAPI 3.1 document, as GET /api/v1/openapi.json answers it. */
const OpenApiDocumentSchema = z.looseObject({
  openapi: z.literal("3.1.0"),
  jsonSchemaDialect: z.string(),
  info: z.looseObject({ title: z.string(), version: z.string() }),
  paths: z.record(z.string(), z.record(z.string(), z.unknown())),
});

/** The groups of the reference page, in its order. */
export const TAGS = [
  { name: "This document", description: "The API document itself, as OpenAPI 3.1." },
  { name: "Account", description: "Who is calling, signing up, and invitations seen from the invitee's side." },
  { name: "Calculations", description: "The engines on their own: a make-up's optics and thermal values, and hourly schedules for any site." },
  { name: "Organisation", description: "Members, invitations, API keys and history of an organisation (owners)." },
  { name: "Projects", description: "Projects with their site and façades, and who of the clients sees them." },
  { name: "Glazing library", description: "The organisation's saved make-ups and panes, with revisions." },
  { name: "Options and review", description: "Each façade's glazing options, the requirements they are checked against, comments and approvals." },
  {
    name: "Results and revisions",
    description: "Yearly results per façade and option, side-by-side comparison, and issued (lettered) schedule revisions.",
  },
  { name: "Workbook", description: "The schedule workbook of a revision or of the draft, as .xlsx or one table as CSV." },
  { name: "Weather and uploads", description: "CSV uploads: measured panes into the library, an hourly weather series for a project." },
  { name: "Deliveries", description: "E-mail deliveries of an issued revision's workbook, sent by the job worker." },
] as const;
export type Tag = (typeof TAGS)[number]["name"];

/** A schema with the name it has in the document's components. */
export interface Named {
  name: string;
  schema: z.ZodType;
}

export type RequestBody =
  | ({ kind: "json"; description?: string } & Named)
  | {
      kind: "multipart";
      /** What the CSV file holds, in words. */
      description: string;
      columns: readonly string[];
      required: readonly string[];
      maxRows: number;
    };

export type SuccessBody =
  | ({ kind: "json"; description: string } & Named)
  | { kind: "empty"; description: string }
  | {
      kind: "file";
      description: string;
      contentType: string;
      /** Response headers worth knowing, with what they carry. */
      headers: Record<string, string>;
    };

export interface OperationExample {
  /** Path parameter values (placeholders from EXAMPLE_IDS, replaced by the example test). */
  params?: Record<string, string>;
  query?: Record<string, string>;
  /** The JSON body. */
  body?: unknown;
  /** The uploaded file of a multipart request. */
  file?: { name: string; contentType: string; text: string };
  /** The answer's body (JSON routes). */
  response?: unknown;
}

export interface Operation {
  method: Exclude<RouteMethod, "ALL">;
  /** As in the route table: parameters as `:name`. */
  path: string;
  summary: string;
  description: string;
  tag: Tag;
  /** Path parameters and what each names. */
  params?: Record<string, string>;
  query?: Named;
  body?: RequestBody;
  /** The status of success is the route table row's `ok`; this says what comes with it. */
  response: SuccessBody;
  /** Statuses beyond those the auth rule, the body and the query give, with when they happen. */
  errors?: Partial<Record<400 | 403 | 404 | 409 | 413 | 429, string>>;
  /** Limits that answer 429, in words. */
  rateLimited?: string;
  example: OperationExample;
}

const json = (name: string, schema: z.ZodType, description: string): SuccessBody => ({ kind: "json", name, schema, description });
const body = (name: string, schema: z.ZodType, description?: string): RequestBody => ({ kind: "json", name, schema, description });
const query = (name: string, schema: z.ZodType): Named => ({ name, schema });
const noContent = (description: string): SuccessBody => ({ kind: "empty", description });
const ID = ex.EXAMPLE_IDS;

const XLSX = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";
const workbookHeaders = {
  "content-disposition": 'attachment; filename="…": the project\'s reference, the revision (or "draft") and the year',
};

export const OPERATIONS: readonly Operation[] = [
  {
    method: "GET",
    path: "/api/v1/openapi.json",
    tag: "This document",
    summary: "The API document",
    description:
      "This API's OpenAPI 3.1 document (JSON Schema draft 2020-12): every operation with its schemas, statuses and an example. The reference page /docs/api is rendered from it.",
    response: json("OpenApiDocument", OpenApiDocumentSchema, "The document"),
    example: {
      response: {
        openapi: "3.1.0",
        jsonSchemaDialect: "https://json-schema.org/draft/2020-12/schema",
        info: { title: "Paneray API", version: API_DOCUMENT_VERSION },
        paths: {},
      },
    },
  },
  // ---- Account ---------------------------------------------------------------------------------------------
  {
    method: "GET",
    path: "/api/v1/me",
    tag: "Account",
    summary: "Who is calling",
    description: "The signed-in user (or the owner of the API key) and their organisations, each with their role there.",
    response: json("MeResponse", MeResponse, "The user and their memberships"),
    example: { response: ex.meResponse },
  },
  {
    method: "POST",
    path: "/api/v1/signup",
    tag: "Account",
    summary: "Create an account",
    description:
      "Without an invitation: a new account and organisation, and a mail with a link that confirms the address; the answer is the same whether or not the address already has an account. With `invitationId`: the account joins that organisation with the invited role and is signed in at once (a session cookie is set).",
    body: body("SignUpRequest", SignUpRequest),
    response: json("SignUpResponse", SignUpResponse, "Confirmation mail sent, or (with an invitation) the new member, signed in"),
    rateLimited: "sign-ups per client address",
    example: { body: ex.signUpBody, response: ex.signUpResponse },
  },
  {
    method: "GET",
    path: "/api/v1/invitations/:id",
    tag: "Account",
    summary: "What an invitation is for",
    description: "The organisation, role and status of an invitation, before signing in: the invitation's id in the mailed link is its secret.",
    params: { id: "The invitation's id (from the invitation mail)" },
    response: json("InvitationSummaryResponse", InvitationSummaryResponse, "The invitation"),
    example: { params: { id: ID.invitationId }, response: { invitation: ex.invitationSummary("pending") } },
  },
  {
    method: "POST",
    path: "/api/v1/invitations/:id/accept",
    tag: "Account",
    summary: "Accept an invitation",
    description: "The signed-in user joins the organisation with the invited role; the invitation must be addressed to their e-mail address.",
    params: { id: "The invitation's id" },
    errors: {
      403: "The invitation is addressed to another e-mail address",
      409: "The invitation is no longer pending (accepted, cancelled or expired)",
    },
    response: json("InvitationSummaryResponse", InvitationSummaryResponse, "The accepted invitation"),
    example: { params: { id: ID.invitationId }, response: { invitation: ex.invitationSummary("accepted") } },
  },
  // ---- Calculations ----------------------------------------------------------------------------------------
  {
    method: "POST",
    path: "/api/v1/calc/glazing",
    tag: "Calculations",
    summary: "Optics and thermal values of a make-up",
    description:
      "Solar and light transmittance and reflectances at each angle of incidence, hemispherical values, the g-value (EN 410) and the centre-of-glass U-value (EN 673) of a make-up given layer by layer, outdoors first: panes (glass properties or measured values) and gas gaps. Values are estimates for comparing options, not declared values.",
    body: body("GlazingRequest", GlazingRequest, "Layers outdoors first, alternating pane and gap, starting and ending with a pane"),
    errors: { 400: "A layer the engine refuses (e.g. measured values no pane can have), named in `errors`" },
    response: json("GlazingResponse", GlazingResponse, "The values at each requested angle and over the hemisphere"),
    example: { body: ex.glazingBody, response: ex.glazingResponse() },
  },
  {
    method: "POST",
    path: "/api/v1/calc/schedule",
    tag: "Calculations",
    summary: "Hourly sun and transmitted solar energy",
    description:
      "For a site and one or more surfaces (orientation, tilt, make-up, optional shading devices): the sun's position, irradiance on each surface, and transmitted solar energy and solar gain, step by step over the period, with daily, monthly and whole-period totals. Clear sky unless an hourly `weather` series is given. At most 52,704 rows (surfaces × steps) per request.",
    body: body("ScheduleRequest", ScheduleRequest),
    errors: { 413: "The request asks for more rows (surfaces × time steps) than one request may compute" },
    response: json("ScheduleResponse", ScheduleResponse, "Rows and totals per surface (the example shows three of its rows)"),
    example: { body: ex.scheduleBody, response: ex.scheduleResponse() },
  },
  // ---- Organisation ----------------------------------------------------------------------------------------
  {
    method: "GET",
    path: "/api/v1/orgs/:orgId/members",
    tag: "Organisation",
    summary: "List members",
    description: "One page of the organisation's members (oldest membership first) and the first page of its pending invitations.",
    params: { orgId: "The organisation's id" },
    query: query("InstantPageQuery", InstantPageQuery),
    response: json("MembersPageResponse", MembersPageResponse, "Members and pending invitations"),
    example: { params: { orgId: ID.organizationId }, query: { limit: "50" }, response: ex.membersPage },
  },
  {
    method: "PATCH",
    path: "/api/v1/orgs/:orgId/members/:memberId",
    tag: "Organisation",
    summary: "Change a member's role",
    description: "Gives a member another role. The last owner of an organisation keeps the owner role.",
    params: { orgId: "The organisation's id", memberId: "The member's id (not the user's)" },
    body: body("MemberRoleRequest", MemberRoleRequest),
    errors: { 404: "No such member in this organisation", 409: "The change would leave the organisation without an owner" },
    response: json("MemberListResponse", MemberListResponse, "The members after the change"),
    example: {
      params: { orgId: ID.organizationId, memberId: ID.otherMemberId },
      body: { role: "consultant" },
      response: ex.memberList("consultant"),
    },
  },
  {
    method: "DELETE",
    path: "/api/v1/orgs/:orgId/members/:memberId",
    tag: "Organisation",
    summary: "Remove a member",
    description: "Removes a member from the organisation; their account stays. The last owner cannot be removed.",
    params: { orgId: "The organisation's id", memberId: "The member's id" },
    errors: { 409: "The member is the organisation's last owner" },
    response: json("MemberListResponse", MemberListResponse, "The members after the removal"),
    example: { params: { orgId: ID.organizationId, memberId: ID.otherMemberId }, response: ex.memberList(null) },
  },
  {
    method: "GET",
    path: "/api/v1/orgs/:orgId/invitations",
    tag: "Organisation",
    summary: "List pending invitations",
    description: "One page of the organisation's pending invitations, oldest first.",
    params: { orgId: "The organisation's id" },
    query: query("InstantPageQuery", InstantPageQuery),
    response: json("InvitationsPageResponse", InvitationsPageResponse, "Pending invitations"),
    example: { params: { orgId: ID.organizationId }, response: { invitations: [ex.invitationEntry], nextCursor: null } },
  },
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/invitations",
    tag: "Organisation",
    summary: "Invite someone",
    description: "Invites an e-mail address with a role; the mail carries the link to join. Inviting the same address again sends a new mail.",
    params: { orgId: "The organisation's id" },
    body: body("InvitationRequest", InvitationRequest),
    errors: { 409: "The address already belongs to a member" },
    response: json("InvitationCreatedResponse", InvitationCreatedResponse, "The invitation and every pending invitation"),
    example: { params: { orgId: ID.organizationId }, body: ex.invitationBody, response: ex.invitationCreated },
  },
  {
    method: "DELETE",
    path: "/api/v1/orgs/:orgId/invitations/:invitationId",
    tag: "Organisation",
    summary: "Cancel an invitation",
    description: "Cancels a pending invitation: its link stops working.",
    params: { orgId: "The organisation's id", invitationId: "The invitation's id" },
    errors: { 404: "No pending invitation with this id in this organisation" },
    response: json("InvitationListResponse", InvitationListResponse, "The pending invitations after the change"),
    example: { params: { orgId: ID.organizationId, invitationId: ID.invitationId }, response: { invitations: [] } },
  },
  {
    method: "GET",
    path: "/api/v1/orgs/:orgId/api-keys",
    tag: "Organisation",
    summary: "List API keys",
    description:
      "One page of the organisation's API keys, newest first, revoked ones included: name, scope, the first characters, who made it, when it was last used. Never the key itself.",
    params: { orgId: "The organisation's id" },
    query: query("InstantPageQuery", InstantPageQuery),
    response: json("ApiKeyListResponse", ApiKeyListResponse, "The keys"),
    example: { params: { orgId: ID.organizationId }, response: ex.apiKeyList },
  },
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/api-keys",
    tag: "Organisation",
    summary: "Create an API key",
    description:
      "A named key with the scope read (GET routes), calculate (read and the two calculation routes) or read-write (what its owner may do, except managing keys, members and invitations). The answer carries the key itself, this once: only its SHA-256 is stored. The key acts as the owner who made it, in this organisation only, while they are an owner here. Recorded in the organisation's history.",
    params: { orgId: "The organisation's id" },
    body: body("ApiKeyCreateRequest", ApiKeyCreateRequest),
    response: json("ApiKeyCreatedResponse", ApiKeyCreatedResponse, "The new key, shown once"),
    example: { params: { orgId: ID.organizationId }, body: ex.apiKeyBody, response: ex.apiKeyCreated },
  },
  {
    method: "DELETE",
    path: "/api/v1/orgs/:orgId/api-keys/:id",
    tag: "Organisation",
    summary: "Revoke an API key",
    description: "Revokes the key at once: the next request that carries it answers 401. Recorded in the organisation's history.",
    params: { orgId: "The organisation's id", id: "The key's id" },
    errors: { 404: "No such key in this organisation", 409: "The key is already revoked" },
    response: json("ApiKeyRevokedResponse", ApiKeyRevokedResponse, "The revoked key"),
    example: { params: { orgId: ID.organizationId, id: ID.apiKeyId }, response: ex.apiKeyRevoked },
  },
  {
    method: "GET",
    path: "/api/v1/orgs/:orgId/history",
    tag: "Organisation",
    summary: "The organisation's history",
    description: "One page of what happened to the organisation (API keys created and revoked), newest first, with who did it.",
    params: { orgId: "The organisation's id" },
    query: query("InstantPageQuery", InstantPageQuery),
    response: json("OrganizationHistoryResponse", OrganizationHistoryResponse, "The events"),
    example: { params: { orgId: ID.organizationId }, response: ex.orgHistory },
  },
  // ---- Projects --------------------------------------------------------------------------------------------
  {
    method: "GET",
    path: "/api/v1/projects",
    tag: "Projects",
    summary: "List projects",
    description: "One page of the projects the caller sees, most recently changed first, grouped by organisation.",
    query: query("ProjectListQuery", ProjectListQuery),
    response: json("ProjectListResponse", ProjectListResponse, "Projects per organisation"),
    example: { query: { limit: "20", organizationId: ID.organizationId }, response: ex.projectList },
  },
  {
    method: "POST",
    path: "/api/v1/projects",
    tag: "Projects",
    summary: "Create a project",
    description: "A project of the organisation named in the body, with its site and (optionally) its façades.",
    body: body("ProjectCreateRequest", ProjectCreateRequest),
    response: json("ProjectCreatedResponse", ProjectCreatedResponse, "The project (`Location` names it)"),
    example: { body: ex.projectCreateBody, response: { project: ex.project(ID.projectId) } },
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id",
    tag: "Projects",
    summary: "Get a project",
    description: "The project, its façades in order and the caller's role in its organisation.",
    params: { id: "The project's id" },
    response: json("ProjectResponse", ProjectResponse, "The project and its façades"),
    example: { params: { id: ID.projectId }, response: { project: ex.project(ID.projectId), facades: [ex.facade], role: "owner" } },
  },
  {
    method: "PATCH",
    path: "/api/v1/projects/:id",
    tag: "Projects",
    summary: "Edit a project",
    description:
      "Changes the fields sent. `facades`, when sent, is the whole new list: façades with an `id` are kept and changed, without one added, and façades left out are deleted with their options.",
    params: { id: "The project's id" },
    body: body("ProjectUpdateRequest", ProjectUpdateRequest),
    response: json("ProjectUpdatedResponse", ProjectUpdatedResponse, "The project and its façades after the change"),
    example: {
      params: { id: ID.projectId },
      body: ex.projectPatchBody,
      response: {
        project: { ...ex.project(ID.projectId), description: ex.projectPatchBody.description, updatedAt: ex.EXAMPLE_LATER },
        facades: [ex.facade],
      },
    },
  },
  {
    method: "DELETE",
    path: "/api/v1/projects/:id",
    tag: "Projects",
    summary: "Delete a project",
    description: "Deletes the project with its façades, options, comments, revisions and deliveries.",
    params: { id: "The project's id" },
    response: noContent("Deleted"),
    example: { params: { id: ID.otherProjectId } },
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/shares",
    tag: "Projects",
    summary: "Who of the clients sees the project",
    description: "One page of the organisation's members who see only shared projects (clients), by name, each with whether they see this one.",
    params: { id: "The project's id" },
    query: query("TextPageQuery", TextPageQuery),
    response: json("SharesPageResponse", SharesPageResponse, "Members and whether each sees the project"),
    example: { params: { id: ID.projectId }, response: { shares: [ex.share(true)], nextCursor: null } },
  },
  {
    method: "POST",
    path: "/api/v1/projects/:id/shares",
    tag: "Projects",
    summary: "Share the project with a client",
    description: "Lets a member who sees only shared projects see this one.",
    params: { id: "The project's id" },
    body: body("ShareRequest", ShareRequest),
    errors: { 400: "The member sees every project already (their role), or is not a member of the organisation" },
    response: json("SharesPageResponse", SharesPageResponse, "The first page of members after the change"),
    example: { params: { id: ID.projectId }, body: { memberId: ID.memberId }, response: { shares: [ex.share(true)], nextCursor: null } },
  },
  {
    method: "DELETE",
    path: "/api/v1/projects/:id/shares/:memberId",
    tag: "Projects",
    summary: "Stop sharing the project with a client",
    description: "The member no longer sees the project.",
    params: { id: "The project's id", memberId: "The member's id" },
    response: json("ShareListResponse", ShareListResponse, "The members after the change"),
    example: { params: { id: ID.projectId, memberId: ID.memberId }, response: { shares: [ex.share(false)] } },
  },
  // ---- Glazing library -------------------------------------------------------------------------------------
  {
    method: "GET",
    path: "/api/v1/orgs/:orgId/makeups",
    tag: "Glazing library",
    summary: "List saved make-ups",
    description: "One page of the organisation's make-ups by name, each at its current revision with its stored values.",
    params: { orgId: "The organisation's id" },
    query: query("TextPageQuery", TextPageQuery),
    response: json("MakeupPageResponse", MakeupPageResponse, "Make-ups"),
    example: { params: { orgId: ID.organizationId }, query: { limit: "20" }, response: { items: [ex.makeup()], nextCursor: null } },
  },
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/makeups",
    tag: "Glazing library",
    summary: "Save a make-up",
    description: "Saves a make-up as revision 1: its description is generated from the layers and its values are computed and stored.",
    params: { orgId: "The organisation's id" },
    body: body("MakeupCreateRequest", MakeupCreateRequest),
    errors: { 400: "A layer the engine refuses, named in `errors`" },
    response: json("MakeupEntry", MakeupEntry, "The saved make-up (`Location` names it)"),
    example: { params: { orgId: ID.organizationId }, body: ex.makeupCreateBody, response: ex.makeup() },
  },
  {
    method: "GET",
    path: "/api/v1/makeups/:id",
    tag: "Glazing library",
    summary: "Get a make-up",
    description: "A saved make-up at its current revision (or `?revision=N`), with its revision history and the façade options that use it.",
    params: { id: "The make-up's id" },
    query: query("MakeupRevisionQuery", MakeupRevisionQuery),
    errors: { 400: "`revision` is not a whole number from 1" },
    response: json("MakeupDetailResponse", MakeupDetailResponse, "The make-up, its revisions and its uses"),
    example: { params: { id: ID.makeupId }, response: ex.makeupDetail },
  },
  {
    method: "PATCH",
    path: "/api/v1/makeups/:id",
    tag: "Glazing library",
    summary: "Save a new revision of a make-up",
    description:
      "Saves the changes as the next revision. `revision` is the one the change was based on; options keep pointing at the revision they use until moved on.",
    params: { id: "The make-up's id" },
    body: body("MakeupPatchRequest", MakeupPatchRequest),
    errors: { 409: "Someone saved a newer revision meanwhile" },
    response: json("MakeupEntry", MakeupEntry, "The make-up at its new revision"),
    example: { params: { id: ID.makeupId }, body: ex.makeupPatchBody, response: ex.makeup({ revision: 2, note: ex.makeupPatchBody.note }) },
  },
  {
    method: "DELETE",
    path: "/api/v1/makeups/:id",
    tag: "Glazing library",
    summary: "Delete a make-up",
    description: "Deletes the make-up with its revisions.",
    params: { id: "The make-up's id" },
    errors: { 409: "Options use the make-up (they are named in the message)" },
    response: noContent("Deleted"),
    example: { params: { id: ID.otherMakeupId } },
  },
  {
    method: "GET",
    path: "/api/v1/orgs/:orgId/panes",
    tag: "Glazing library",
    summary: "List saved panes",
    description: "One page of the organisation's panes by name.",
    params: { orgId: "The organisation's id" },
    query: query("TextPageQuery", TextPageQuery),
    response: json("PanePageResponse", PanePageResponse, "Panes"),
    example: { params: { orgId: ID.organizationId }, response: { items: [ex.pane()], nextCursor: null } },
  },
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/panes",
    tag: "Glazing library",
    summary: "Save a pane",
    description: "Saves a pane (glass properties, or measured solar and light values) as revision 1.",
    params: { orgId: "The organisation's id" },
    body: body("PaneCreateRequest", PaneCreateRequest),
    response: json("PaneEntry", PaneEntry, "The saved pane (`Location` names it)"),
    example: { params: { orgId: ID.organizationId }, body: ex.paneCreateBody, response: ex.pane() },
  },
  {
    method: "GET",
    path: "/api/v1/panes/:id",
    tag: "Glazing library",
    summary: "Get a pane",
    description: "A saved pane at its current revision.",
    params: { id: "The pane's id" },
    response: json("PaneEntry", PaneEntry, "The pane"),
    example: { params: { id: ID.paneId }, response: ex.pane() },
  },
  {
    method: "PATCH",
    path: "/api/v1/panes/:id",
    tag: "Glazing library",
    summary: "Save a new revision of a pane",
    description: "Saves the changes as the next revision; make-ups hold copies of their panes and do not change.",
    params: { id: "The pane's id" },
    body: body("PanePatchRequest", PanePatchRequest),
    errors: { 409: "Someone saved a newer revision meanwhile" },
    response: json("PaneEntry", PaneEntry, "The pane at its new revision"),
    example: { params: { id: ID.paneId }, body: ex.panePatchBody, response: ex.pane({ revision: 2, note: ex.panePatchBody.note }) },
  },
  {
    method: "DELETE",
    path: "/api/v1/panes/:id",
    tag: "Glazing library",
    summary: "Delete a pane",
    description: "Deletes the pane; make-ups that were built from it keep their copy.",
    params: { id: "The pane's id" },
    response: noContent("Deleted"),
    example: { params: { id: ID.paneId } },
  },
  // ---- Options and review ----------------------------------------------------------------------------------
  {
    method: "GET",
    path: "/api/v1/projects/:id/options",
    tag: "Options and review",
    summary: "List a project's options",
    description: "Every option of the project's façades with the make-up revision it points at and the library's newest revision of that make-up.",
    params: { id: "The project's id" },
    response: json("OptionListResponse", OptionListResponse, "Options"),
    example: { params: { id: ID.projectId }, response: { options: [ex.option()] } },
  },
  {
    method: "POST",
    path: "/api/v1/projects/:id/options",
    tag: "Options and review",
    summary: "Add an option to a façade",
    description: "A glazing option for one façade, pointing at a saved make-up's current revision; it starts as proposed.",
    params: { id: "The project's id" },
    body: body("OptionCreateRequest", OptionCreateRequest),
    errors: { 400: "The façade is not the project's, or the make-up not the organisation's" },
    response: json("OptionCreatedResponse", OptionCreatedResponse, "The option (`Location` names it)"),
    example: {
      params: { id: ID.projectId },
      body: ex.optionCreateBody,
      response: { option: ex.option({ id: ID.otherOptionId, name: ex.optionCreateBody.name }) },
    },
  },
  {
    method: "PATCH",
    path: "/api/v1/options/:id",
    tag: "Options and review",
    summary: "Rename, re-point or move an option",
    description:
      'Renames the option, points it at another make-up (`makeupId`) or at its make-up\'s newest revision (`makeupRevision: "latest"`), or moves it (`position`). A changed make-up revision sends an approved option back to proposed.',
    params: { id: "The option's id" },
    body: body("OptionPatchRequest", OptionPatchRequest),
    errors: { 409: "`version` is not the option's latest" },
    response: json("OptionUpdatedResponse", OptionUpdatedResponse, "The option after the change"),
    example: {
      params: { id: ID.optionId },
      body: { version: 1, name: "Low-e argon, laminated inner pane" },
      response: { option: ex.option({ name: "Low-e argon, laminated inner pane", version: 2 }), approvalWithdrawn: false },
    },
  },
  {
    method: "DELETE",
    path: "/api/v1/options/:id",
    tag: "Options and review",
    summary: "Remove an option",
    description: "Removes the option with its comments and decisions.",
    params: { id: "The option's id" },
    response: noContent("Removed"),
    example: { params: { id: ID.otherOptionId } },
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/requirements",
    tag: "Options and review",
    summary: "Get the requirements",
    description:
      "The limits the project's options are checked against (from the brief or the code the project follows), per-façade overrides, and the version to send back.",
    params: { id: "The project's id" },
    response: json("RequirementsResponse", RequirementsResponse, "Limits and overrides"),
    example: { params: { id: ID.projectId }, response: ex.requirements(1) },
  },
  {
    method: "PUT",
    path: "/api/v1/projects/:id/requirements",
    tag: "Options and review",
    summary: "Set the requirements",
    description:
      "Replaces the limits and per-façade overrides (an override replaces the project's limit key by key). Paneray ships no code values; local codes and the project's professionals decide.",
    params: { id: "The project's id" },
    body: body("RequirementsRequest", RequirementsRequest),
    errors: { 409: "`version` is not the latest" },
    response: json("RequirementsResponse", RequirementsResponse, "The requirements as saved"),
    example: { params: { id: ID.projectId }, body: ex.requirementsBody, response: ex.requirements(1) },
  },
  {
    method: "GET",
    path: "/api/v1/options/:id/comments",
    tag: "Options and review",
    summary: "Comments and decisions of an option",
    description: "The option's comment thread, oldest first (each comment names the one it answers), its status and its decisions.",
    params: { id: "The option's id" },
    response: json("CommentsResponse", CommentsResponse, "Thread, status and decisions"),
    example: { params: { id: ID.optionId }, response: { status: "proposed", comments: [ex.comment], decisions: [] } },
  },
  {
    method: "POST",
    path: "/api/v1/options/:id/comments",
    tag: "Options and review",
    summary: "Comment on an option",
    description: "Adds a comment, or an answer to one (`parentId`).",
    params: { id: "The option's id" },
    body: body("CommentRequest", CommentRequest),
    response: json("CommentView", CommentView, "The comment"),
    example: { params: { id: ID.optionId }, body: { body: ex.comment.body }, response: ex.comment },
  },
  {
    method: "POST",
    path: "/api/v1/options/:id/decision",
    tag: "Options and review",
    summary: "Approve or reject an option",
    description:
      "Approving replaces the façade's previously approved option (which goes back to proposed). An issued revision takes each façade's approved option.",
    params: { id: "The option's id" },
    body: body("DecisionRequest", DecisionRequest),
    response: json("DecisionResponse", DecisionResponse, "The option's new status and its decisions"),
    example: { params: { id: ID.otherOptionId }, body: ex.decisionBody, response: ex.decisionResponse },
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/history",
    tag: "Options and review",
    summary: "The project's history",
    description: "One page of what happened to the project (options added, approved, requirements changed, revisions issued, …), newest first.",
    params: { id: "The project's id" },
    query: query("InstantPageQuery", InstantPageQuery),
    response: json("HistoryResponse", HistoryResponse, "Events"),
    example: { params: { id: ID.projectId }, query: { limit: "20" }, response: ex.history },
  },
  // ---- Results and revisions -------------------------------------------------------------------------------
  {
    method: "GET",
    path: "/api/v1/projects/:id/results",
    tag: "Results and revisions",
    summary: "Results of every façade and option",
    description:
      "For a year (`?year=`, default the current year): each façade's options with their stored values, annual and monthly transmitted energy and solar gain per m², peak, and pass/fail flags against the requirements; from the project's weather file when it has one, else the clear sky. Estimates, not certified values.",
    params: { id: "The project's id" },
    query: query("ResultsQuery", ResultsQuery),
    response: json("ResultsResponse", ResultsResponse, "Results per façade and option"),
    example: { params: { id: ID.projectId }, query: { year: String(ex.EXAMPLE_YEAR) }, response: ex.resultsResponse() },
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/compare",
    tag: "Results and revisions",
    summary: "Compare options side by side",
    description:
      "Two to six options (`?options=id,id`): their results, angular values from 0° to 90° by 5°, and each surface as POST /calc/schedule takes it.",
    params: { id: "The project's id" },
    query: query("CompareQuery", CompareQuery),
    errors: { 400: "Fewer than two or more than six options, or an option not of this project" },
    response: json("CompareResponse", CompareResponse, "The options with their results and curves (the example shows two angles of nineteen)"),
    example: {
      params: { id: ID.projectId },
      query: { options: `${ID.optionId},${ID.otherOptionId}`, year: String(ex.EXAMPLE_YEAR) },
      response: ex.compareResponse(),
    },
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/revisions",
    tag: "Results and revisions",
    summary: "List issued revisions",
    description: "The project's issued schedule revisions, newest first, each frozen as issued. Clients of a shared project read them too.",
    params: { id: "The project's id" },
    response: json("RevisionListResponse", RevisionListResponse, "Revisions"),
    example: { params: { id: ID.projectId }, response: { revisions: [ex.revisionResponse()] } },
  },
  {
    method: "POST",
    path: "/api/v1/projects/:id/revisions",
    tag: "Results and revisions",
    summary: "Issue a revision",
    description:
      "Freezes every façade's approved option with its results for the year as the next lettered revision (A, B, …); façades without an approved option are listed in `unapproved`.",
    params: { id: "The project's id" },
    body: body("RevisionIssueRequest", RevisionIssueRequest),
    errors: { 409: "No façade has an approved option" },
    response: json("RevisionResponse", RevisionResponse, "The issued revision"),
    example: { params: { id: ID.projectId }, body: ex.revisionBody, response: ex.revisionResponse() },
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/revisions/:rev",
    tag: "Results and revisions",
    summary: "Get an issued revision",
    description: "One issued revision by its letter, as it was issued.",
    params: { id: "The project's id", rev: "The revision's letter (A, B, …)" },
    response: json("RevisionResponse", RevisionResponse, "The revision"),
    example: { params: { id: ID.projectId, rev: "A" }, response: ex.revisionResponse() },
  },
  // ---- Workbook --------------------------------------------------------------------------------------------
  {
    method: "GET",
    path: "/api/v1/projects/:id/workbook",
    tag: "Workbook",
    summary: "Download the schedule workbook (.xlsx)",
    description:
      "The glazing schedule, each façade's hourly table and the make-ups' angular values as one workbook, streamed. `?revision=A`: an issued revision (every role that sees the project). Without `revision`: the current draft (owners and consultants), for `?year=`.",
    params: { id: "The project's id" },
    query: query("WorkbookQuery", WorkbookQuery),
    errors: { 403: "The draft was asked for by a role that receives only issued revisions", 404: "No such revision" },
    response: { kind: "file", description: "The workbook", contentType: XLSX, headers: workbookHeaders },
    example: { params: { id: ID.projectId }, query: { revision: "A" } },
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/workbook.csv",
    tag: "Workbook",
    summary: "Download one table of the workbook as CSV",
    description: "`table=cover|schedule|hourly|angles`; `hourly` and `angles` need `facadeId`. `revision` and `year` as for the workbook.",
    params: { id: "The project's id" },
    query: query("WorkbookCsvQuery", WorkbookCsvQuery),
    errors: {
      403: "The draft was asked for by a role that receives only issued revisions",
      404: "No such revision, or the façade has no approved option in it",
    },
    response: {
      kind: "file",
      description: "The table as CSV (comma-separated, header row first)",
      contentType: "text/csv; charset=utf-8",
      headers: workbookHeaders,
    },
    example: { params: { id: ID.projectId }, query: { revision: "A", table: "schedule" } },
  },
  // ---- Weather and uploads ---------------------------------------------------------------------------------
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/panes/import",
    tag: "Weather and uploads",
    summary: "Import measured panes from a CSV file",
    description:
      "Every row of the file becomes a saved pane (revision 1). A file with problems is refused whole: 400 lists each problem with its line (the header is line 1) and column, and nothing is saved.",
    params: { orgId: "The organisation's id" },
    body: {
      kind: "multipart",
      description: "Solar values 0–1 at normal incidence; light values optional; emissivities default to 0.837 (uncoated glass).",
      columns: PANE_COLUMNS,
      required: PANE_REQUIRED_COLUMNS,
      maxRows: MAX_PANE_ROWS,
    },
    errors: { 400: "The file has problems (each with line and column in `errors`); nothing was saved" },
    response: json("PaneImportResponse", PaneImportResponse, "The saved panes and the file as kept"),
    example: { params: { orgId: ID.organizationId }, file: ex.panesFile, response: ex.paneImport },
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/weather",
    tag: "Weather and uploads",
    summary: "The project's weather series",
    description: "The uploaded hourly weather series (period, hours, file and SHA-256), or `weather: null` while the results use the clear sky.",
    params: { id: "The project's id" },
    response: json("WeatherResponse", WeatherResponse, "The series, or null"),
    example: { params: { id: ID.projectId }, response: { weather: ex.weatherSummary } },
  },
  {
    method: "POST",
    path: "/api/v1/projects/:id/weather",
    tag: "Weather and uploads",
    summary: "Upload an hourly weather series",
    description:
      "Hourly global, direct normal and diffuse irradiance (W/m²) in place of the clear sky for the project's results; replaces an earlier file. `time` is the start of the hour: local time of the project's zone, or an instant with an offset. A file with problems is refused whole (400 with line and column), nothing saved.",
    params: { id: "The project's id" },
    body: {
      kind: "multipart",
      description: "One row per hour; irradiances in W/m², air temperature in °C (optional).",
      columns: WEATHER_COLUMNS,
      required: WEATHER_REQUIRED_COLUMNS,
      maxRows: MAX_WEATHER_ROWS,
    },
    errors: { 400: "The file has problems (each with line and column in `errors`); nothing was saved" },
    response: json("WeatherCreatedResponse", WeatherCreatedResponse, "The series as saved"),
    example: { params: { id: ID.projectId }, file: ex.weatherFile, response: ex.weatherCreated },
  },
  {
    method: "DELETE",
    path: "/api/v1/projects/:id/weather",
    tag: "Weather and uploads",
    summary: "Remove the weather series",
    description: "The project's results use the clear-sky model again. Issued revisions keep the weather they were computed from.",
    params: { id: "The project's id" },
    response: noContent("Removed"),
    example: { params: { id: ID.projectId } },
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/weather/file",
    tag: "Weather and uploads",
    summary: "Download the weather file",
    description: "The weather file exactly as it was uploaded.",
    params: { id: "The project's id" },
    errors: { 404: "The project has no weather file" },
    response: {
      kind: "file",
      description: "The CSV file as uploaded",
      contentType: "text/csv; charset=utf-8",
      headers: { "content-disposition": "attachment; filename=…: the uploaded file's name", "x-content-sha256": "SHA-256 of the bytes, hex" },
    },
    example: { params: { id: ID.projectId } },
  },
  // ---- Deliveries ------------------------------------------------------------------------------------------
  {
    method: "GET",
    path: "/api/v1/projects/:id/deliveries",
    tag: "Deliveries",
    summary: "List deliveries",
    description: "One page of the project's e-mail deliveries, newest first, with status and attempts.",
    params: { id: "The project's id" },
    query: query("InstantPageQuery", InstantPageQuery),
    response: json("DeliveryPageResponse", DeliveryPageResponse, "Deliveries"),
    example: { params: { id: ID.projectId }, response: { deliveries: [ex.delivery("sent")], nextCursor: null } },
  },
  {
    method: "POST",
    path: "/api/v1/projects/:id/deliveries",
    tag: "Deliveries",
    summary: "Send an issued revision's workbook by e-mail",
    description:
      "Queues one e-mail with the revision's workbook attached to typed addresses and/or members; answers at once, the job worker sends it and retries on failure. Follow it with GET /deliveries/:id.",
    params: { id: "The project's id" },
    body: body("DeliveryRequest", DeliveryRequest),
    errors: { 400: "No such issued revision, no recipient, or a member who does not receive exports" },
    rateLimited: "deliveries per organisation and hour",
    response: json("DeliveryCreatedResponse", DeliveryCreatedResponse, "The queued delivery (`Location` names it)"),
    example: {
      params: { id: ID.projectId },
      body: ex.deliveryBody,
      response: { id: ID.deliveryId, status: "queued", delivery: ex.delivery("queued") },
    },
  },
  {
    method: "GET",
    path: "/api/v1/deliveries/:id",
    tag: "Deliveries",
    summary: "A delivery's status",
    description: "Status (queued, sending, sent, failed), attempts, the last error and the attachment (name, size, SHA-256).",
    params: { id: "The delivery's id" },
    response: json("DeliveryStatusResponse", DeliveryStatusResponse, "The delivery"),
    example: { params: { id: ID.deliveryId }, response: { delivery: ex.delivery("sent") } },
  },
  {
    method: "GET",
    path: "/api/v1/deliveries/:id/attachment",
    tag: "Deliveries",
    summary: "Download the attached workbook",
    description: "The exact workbook the delivery attached (built when the first attempt starts).",
    params: { id: "The delivery's id" },
    errors: { 404: "The workbook has not been built yet" },
    response: {
      kind: "file",
      description: "The workbook",
      contentType: XLSX,
      headers: {
        "content-disposition": "attachment; filename=…",
        "x-content-sha256": "SHA-256 of the bytes, hex (as in the delivery's `attachment`)",
      },
    },
    example: { params: { id: ID.deliveryId } },
  },
];

/** "METHOD /path", the key of an operation (and of a route table row). */
export const operationKey = (o: Pick<Operation, "method" | "path">) => `${o.method} ${o.path}`;

/** The path parameters of a route pattern, in order. */
export const pathParams = (path: string) => [...path.matchAll(/:(\w+)/g)].map((m) => m[1]!);

/** The URL of an example: parameters filled in, the query appended. */
export function exampleUrl(o: Operation, substitute: (value: string) => string = (v) => v): string {
  const path = o.path.replace(/:(\w+)/g, (_, n: string) => encodeURIComponent(substitute(o.example.params?.[n] ?? `:${n}`)));
  const q = Object.entries(o.example.query ?? {});
  return q.length ? `${path}?${new URLSearchParams(q.map(([k, v]) => [k, substitute(v)])).toString().replace(/%2C/g, ",")}` : path;
}
