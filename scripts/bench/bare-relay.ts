// The bare socket.io relay the live thread is measured against: the same events as Sporewell
// (`case:join`, `message:send` with an ack, `message:new` to the rest of the room), but no
// session, no checks and no storage: the ack goes at once and the message is passed on as sent.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { Server } from 'socket.io';

const httpServer = http.createServer();
const io = new Server(httpServer, { serveClient: false });
io.on('connection', (socket) => {
  socket.on('case:join', (payload: { caseId: number }, ack?: (res: unknown) => void) => {
    void socket.join(`case:${payload.caseId}`);
    ack?.({ ok: true, messages: [], presence: [], hasMore: false });
  });
  socket.on('message:send', (payload: { caseId: number; clientId: string; body: string }, ack?: (res: unknown) => void) => {
    const message = { caseId: payload.caseId, clientId: payload.clientId, body: payload.body, kind: 'text', createdAt: new Date().toISOString() };
    ack?.({ ok: true, message, duplicate: false });
    socket.to(`case:${payload.caseId}`).emit('message:new', message);
  });
});
httpServer.listen(0, '127.0.0.1', () => {
  const { port } = httpServer.address() as AddressInfo;
  process.send?.({ type: 'listening', url: `http://127.0.0.1:${port}`, port });
});
const stop = () => {
  io.disconnectSockets(true);
  io.close(() => process.exit(0));
};
process.once('SIGTERM', stop);
process.once('SIGINT', stop);
