// Preloaded (node --import) into the Next.js server by spawnNext. Next.js hands route handlers
// no socket, so this writes each request's TCP peer address into a header before Next.js sees the
// request, replacing any copy the client sent; server/auth/client-address.ts reads it only when the
// process carries the mark set here. Plain JavaScript: it runs before any TypeScript loader.
import http from "node:http";

const PEER_HEADER = "x-loopshift-peer";
process.env.LOOPSHIFT_PEER_FROM_SOCKET = "1";

const emit = http.Server.prototype.emit;
http.Server.prototype.emit = function emitWithPeer(event, ...args) {
  if (event === "request" || event === "upgrade") {
    const req = args[0];
    req.headers[PEER_HEADER] = (req.socket && req.socket.remoteAddress) || "";
  }
  return emit.call(this, event, ...args);
};
