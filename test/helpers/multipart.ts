/** One part of a multipart/form-data body: a field, or a file when it has a file name. */
export interface FormPart {
  name: string;
  filename?: string;
  content: string | Buffer;
}

/** A multipart/form-data body (RFC 7578) of named parts, as `curl -F` sends them, and its Content-Type. */
export const multipartBody = (parts: FormPart[]): { body: Buffer; contentType: string } => {
  const boundary = "----elastilog-test-boundary";
  const chunks = parts.flatMap((part) => [
    Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="${part.name}"${part.filename ? `; filename="${part.filename}"` : ""}\r\n` +
        `${part.filename ? "Content-Type: application/octet-stream\r\n" : ""}\r\n`,
    ),
    Buffer.isBuffer(part.content) ? part.content : Buffer.from(part.content),
    Buffer.from("\r\n"),
  ]);
  return { body: Buffer.concat([...chunks, Buffer.from(`--${boundary}--\r\n`)]), contentType: `multipart/form-data; boundary=${boundary}` };
};
