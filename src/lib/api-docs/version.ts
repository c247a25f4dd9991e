/**
 * The version of the API document (info.version of /api/v1/openapi.json). Raise it with every change of the
 * document and write the change into docs/api-changelog.md: a minor version for additions, a patch version for
 * corrected wording or examples. `/api/v1` changes only by addition; a removal gets a new prefix.
 */
export const API_DOCUMENT_VERSION = "1.0.0";
