// Writes a page kept in memory, compressed once, for both ways a request reaches it: the HTTP
// server's fast path and Express. 304 when the reader's copy is current (Express's own `fresh`), else
// the best encoding the reader accepts (Express's own `accepts`), with its length.
import type { IncomingMessage, OutgoingHttpHeaders, ServerResponse } from "node:http";
import accepts from "accepts";
import fresh from "fresh";
import type { CachedPage, Encodings } from "./page-cache";

export function answerFromCache(req: IncomingMessage, res: ServerResponse, page: Pick<CachedPage, "status" | "etag" | "encodings">, headers: OutgoingHttpHeaders): void {
  const vary = [res.getHeader("vary"), headers.vary, "Accept-Encoding"].filter(Boolean).join(", ");
  if (page.status === 200 && fresh(req.headers, { etag: page.etag })) {
    res.writeHead(304, { ...headers, vary });
    res.end();
    return;
  }
  const encoding = (accepts(req).encodings("br", "gzip", "identity") || "identity") as keyof Encodings;
  const body = page.encodings[encoding] ?? page.encodings.identity;
  res.writeHead(page.status, { ...headers, vary, ...(encoding === "identity" ? {} : { "content-encoding": encoding }), "content-length": body.length });
  res.end(req.method === "HEAD" ? undefined : body);
}
