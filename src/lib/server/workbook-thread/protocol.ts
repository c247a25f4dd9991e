/** Messages of the workbook export thread to the main thread; the main thread answers each chunk with "taken". */
export type ThreadMessage = { chunk: Uint8Array } | { end: true } | { error: { name: string; message: string } };
