// Preloaded into the Next server (node --require): appends the socket's peer address to X-Forwarded-For on
// every request, as a proxy does. `next start` itself keeps a client-supplied X-Forwarded-For unchanged and
// fills in the peer address only when the header is absent, so without this the header's last entry is
// whatever the client wrote. The app reads the chain with TRUSTED_PROXY_HOPS (lib/server/auth/session.ts).
const http = require('node:http');

const emit = http.Server.prototype.emit;
http.Server.prototype.emit = function emitWithPeerAddress(event, request, ...rest) {
  if (event === 'request' && request && request.headers) appendPeerAddress(request);
  return emit.call(this, event, request, ...rest);
};

function appendPeerAddress(request) {
  const peer = request.socket?.remoteAddress || 'unknown';
  const prior = request.headers['x-forwarded-for'];
  const chain = Array.isArray(prior) ? prior.join(', ') : prior;
  request.headers['x-forwarded-for'] = chain ? `${chain}, ${peer}` : peer;
}

module.exports = { appendPeerAddress };
