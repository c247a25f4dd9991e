/**
 * The file of a multipart/form-data upload (one field, `file`), read from the request's body stream through
 * busboy with a hard size limit: the body is read chunk by chunk and given up (413) as soon as the file passes
 * the limit, so a file ten times too large costs no more memory than the limit. The file's bytes come back
 * with their SHA-256, worked out while they arrive.
 */
import { createHash } from "node:crypto";
import Busboy from "busboy";
import { HttpError } from "@/lib/server/http";
import { MAX_UPLOAD_BYTES, UPLOAD_FIELD } from "@/lib/contracts/uploads";

export interface UploadedFile {
  fileName: string;
  contentType: string;
  bytes: Buffer;
  sizeBytes: number;
  sha256: string;
}

/** Room for the multipart boundaries and part headers around the file. */
const ENVELOPE_BYTES = 64 * 1024;

const mb = (n: number) => `${(n / 1024 / 1024).toFixed(n % (1024 * 1024) === 0 ? 0 : 1)} MB`;
const tooLarge = (limit: number) =>
  new HttpError(413, `The file is larger than the limit of ${mb(limit)}; nothing was saved. Split it or leave out what is not needed.`, {
    errors: [{ field: UPLOAD_FIELD, message: `the file must be at most ${mb(limit)}` }],
  });
const badRequest = (message: string) => new HttpError(400, message, { errors: [{ field: UPLOAD_FIELD, message }] });

/** Keeps a name printable and short: control and bidirectional characters and path parts removed. */
function cleanFileName(raw: string | undefined, fallback: string): string {
  const base = (raw ?? "").split(/[\\/]/).pop() ?? "";
  // eslint-disable-next-line no-control-regex
  const clean = base.replace(/[\u0000-\u001f\u007f-\u009f\u200e\u200f\u202a-\u202e\u2066-\u2069\ud800-\udfff]/g, "").trim();
  return (clean || fallback).slice(0, 200);
}

export async function readUploadedFile(request: Request, opts: { maxBytes?: number; fallbackName?: string } = {}): Promise<UploadedFile> {
  const maxBytes = opts.maxBytes ?? MAX_UPLOAD_BYTES;
  const type = request.headers.get("content-type") ?? "";
  if (!/^multipart\/form-data\b/i.test(type) || !/boundary=/i.test(type))
    throw new HttpError(415, `Send the file as multipart/form-data in a field named “${UPLOAD_FIELD}”`, {
      errors: [{ field: UPLOAD_FIELD, message: "expected a multipart/form-data upload" }],
    });
  const declared = Number(request.headers.get("content-length") ?? "NaN");
  if (Number.isFinite(declared) && declared > maxBytes + ENVELOPE_BYTES) throw tooLarge(maxBytes);
  if (!request.body) throw badRequest(`no file was sent in the field “${UPLOAD_FIELD}”`);

  let bb: Busboy.Busboy;
  try {
    bb = Busboy({ headers: { "content-type": type }, limits: { files: 1, fileSize: maxBytes, fields: 20, fieldSize: 4096, parts: 30 } });
  } catch {
    throw badRequest("the upload is not a well-formed multipart/form-data body");
  }
  const reader = request.body.getReader();
  let failure: HttpError | null = null;
  let file: UploadedFile | null = null;
  let fileDone: Promise<void> = Promise.resolve();
  const fail = (e: HttpError) => {
    failure ??= e;
  };

  bb.on("file", (field, stream, info) => {
    if (field !== UPLOAD_FIELD || file) {
      if (file) fail(badRequest("send one file per upload"));
      stream.resume();
      return;
    }
    const hash = createHash("sha256");
    const chunks: Buffer[] = [];
    let size = 0;
    const name = cleanFileName(info.filename, opts.fallbackName ?? "upload.csv");
    file = { fileName: name, contentType: (info.mimeType || "text/csv").slice(0, 100), bytes: Buffer.alloc(0), sizeBytes: 0, sha256: "" };
    fileDone = new Promise<void>((resolve) => {
      stream.on("data", (c: Buffer) => {
        size += c.length;
        hash.update(c);
        chunks.push(c);
      });
      stream.on("limit", () => {
        fail(tooLarge(maxBytes));
        chunks.length = 0;
        stream.resume();
      });
      stream.on("end", () => {
        file!.bytes = Buffer.concat(chunks);
        file!.sizeBytes = size;
        file!.sha256 = hash.digest("hex");
        resolve();
      });
      stream.on("error", () => resolve());
    });
  });
  bb.on("filesLimit", () => fail(badRequest("send one file per upload")));
  bb.on("partsLimit", () => fail(badRequest("the upload has too many parts; send only the file")));
  const finished = new Promise<void>((resolve) => {
    bb.on("close", () => resolve());
    bb.on("error", () => {
      fail(badRequest("the upload is not a well-formed multipart/form-data body"));
      resolve();
    });
  });

  let total = 0;
  try {
    for (;;) {
      if (failure) break;
      const { done, value } = await reader.read();
      if (done) {
        bb.end();
        break;
      }
      total += value.byteLength;
      if (total > maxBytes + ENVELOPE_BYTES) {
        fail(tooLarge(maxBytes));
        break;
      }
      if (!bb.write(value)) await new Promise<void>((resolve) => bb.once("drain", resolve).once("error", resolve).once("close", resolve));
    }
  } catch {
    fail(badRequest("the upload was interrupted before the whole file arrived"));
  }
  if (failure) {
    await reader.cancel().catch(() => {});
    bb.destroy();
    throw failure;
  }
  await finished;
  await fileDone;
  if (failure) throw failure;
  if (!file) throw badRequest(`no file was sent in the field “${UPLOAD_FIELD}”`);
  const f = file as UploadedFile;
  if (f.sizeBytes === 0) throw badRequest("the file is empty");
  return f;
}
